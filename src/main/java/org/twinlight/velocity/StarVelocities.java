package org.twinlight.velocity;

import java.util.Arrays;

/**
 * The velocities measured for one star.
 *
 * @param timesDays times of the measurements, days (the time scale of the {@link VelocityData}),
 *     in file order (not necessarily sorted: several instruments may interleave)
 * @param velocitiesKms line-of-sight velocities, km/s, positive receding
 * @param errorsKms 1σ errors, km/s, all &gt; 0; null when the file gives none
 * @param instruments index of each measurement's instrument in {@link VelocityData#instruments()}
 * @param rowNumbers 1-based line or row of each measurement in the file, for messages
 */
public record StarVelocities(double[] timesDays, double[] velocitiesKms, double[] errorsKms, int[] instruments,
        int[] rowNumbers) {

    public StarVelocities {
        int n = timesDays.length;
        if (velocitiesKms.length != n || instruments.length != n || rowNumbers.length != n
                || (errorsKms != null && errorsKms.length != n)) {
            throw new IllegalArgumentException("times, velocities, errors, instruments and rows differ in length");
        }
    }

    /** No measurements. */
    public static StarVelocities empty(boolean withErrors) {
        return new StarVelocities(new double[0], new double[0], withErrors ? new double[0] : null, new int[0],
                new int[0]);
    }

    public int size() {
        return timesDays.length;
    }

    public boolean hasErrors() {
        return errorsKms != null;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof StarVelocities s && Arrays.equals(timesDays, s.timesDays)
                && Arrays.equals(velocitiesKms, s.velocitiesKms) && Arrays.equals(errorsKms, s.errorsKms)
                && Arrays.equals(instruments, s.instruments) && Arrays.equals(rowNumbers, s.rowNumbers);
    }

    @Override
    public int hashCode() {
        return Arrays.hashCode(timesDays) * 31 + Arrays.hashCode(velocitiesKms);
    }

    @Override
    public String toString() {
        return "StarVelocities[" + size() + " measurements]";
    }
}

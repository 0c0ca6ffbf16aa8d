package org.twinlight.timing.period;

/**
 * A BLS periodogram: signal residue SR (Kovács, Zucker &amp; Mazeh 2002) against trial period.
 * Arrays are copied in and out; periods decrease along the arrays (frequencies increase).
 */
public final class Periodogram {
    private final double[] periodsDays;
    private final double[] power;

    public Periodogram(double[] periodsDays, double[] power) {
        if (periodsDays.length != power.length) {
            throw new IllegalArgumentException("periods and power must have the same length");
        }
        this.periodsDays = periodsDays.clone();
        this.power = power.clone();
    }

    public int size() {
        return power.length;
    }

    public double periodDays(int i) {
        return periodsDays[i];
    }

    public double power(int i) {
        return power[i];
    }

    public double[] periodsDays() {
        return periodsDays.clone();
    }

    public double[] powers() {
        return power.clone();
    }
}

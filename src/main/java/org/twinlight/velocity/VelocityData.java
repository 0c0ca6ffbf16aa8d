package org.twinlight.velocity;

import java.util.List;
import java.util.Map;
import org.twinlight.time.TimeScale;

/**
 * The radial velocities of a binary as read from one file: one set per star, the instruments
 * they came from, the time scale, and what was not used.
 *
 * @param source the file name, for messages
 * @param timeScale time scale of the times ({@link TimeScale#UNKNOWN} when not declared)
 * @param star1 velocities of star 1 (the star eclipsed at primary eclipse)
 * @param star2 velocities of star 2 (empty when the file has none)
 * @param instruments names of the instruments in order of first appearance; one unnamed
 *     instrument ({@code ""}) when the file has no instrument column
 * @param rejected counts of rows or measurements not used, by reason
 * @param notes remarks of the reader (e.g. a time scale overridden by an option)
 */
public record VelocityData(String source, TimeScale timeScale, StarVelocities star1, StarVelocities star2,
        List<String> instruments, Map<String, Integer> rejected, List<String> notes) {

    public VelocityData {
        instruments = List.copyOf(instruments);
        rejected = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(rejected));
        notes = List.copyOf(notes);
    }

    /** The measurements of star {@code n} (1 or 2). */
    public StarVelocities star(int n) {
        return n == 1 ? star1 : star2;
    }

    /** Number of measurements of both stars. */
    public int size() {
        return star1.size() + star2.size();
    }

    /** Number of rows or measurements not used. */
    public int rejectedCount() {
        return rejected.values().stream().mapToInt(Integer::intValue).sum();
    }
}

package org.twinlight.planning;

import java.util.List;
import org.twinlight.time.TimeScale;
import org.twinlight.timing.MinimumType;

/**
 * One predicted minimum seen from the site.
 *
 * @param target the target's name
 * @param type primary or secondary
 * @param cycle cycle count E from the epoch (n, or n + 0.5 for a secondary)
 * @param minimumOwnScale time of minimum in the ephemeris's own scale, days (JD or MJD as the scale says)
 * @param ownScale that scale
 * @param errorDays 1σ of the predicted time, days
 * @param start first contact
 * @param minimum the minimum
 * @param end last contact
 * @param moon the Moon at the minimum
 * @param verdict whole, partial or not observable
 * @param reason why, in words
 * @param errorExceedsTenthOfEclipse true when 1σ is more than a tenth of the eclipse's length
 * @param clashes other targets' observable eclipses that overlap this one ("NAME type HH:MM–HH:MM")
 */
public record Prediction(String target, MinimumType type, double cycle, double minimumOwnScale, TimeScale ownScale,
        double errorDays, SkyAtMoment start, SkyAtMoment minimum, SkyAtMoment end, MoonView moon, Verdict verdict,
        String reason, boolean errorExceedsTenthOfEclipse, List<String> clashes) {

    public Prediction {
        clashes = List.copyOf(clashes);
    }

    /** A copy with clashes marked. */
    public Prediction withClashes(List<String> list) {
        return new Prediction(target, type, cycle, minimumOwnScale, ownScale, errorDays, start, minimum, end, moon,
                verdict, reason, errorExceedsTenthOfEclipse, list);
    }
}

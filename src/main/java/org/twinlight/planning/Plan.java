package org.twinlight.planning;

import java.util.List;
import org.twinlight.sky.Site;

/**
 * A plan: every predicted minimum of the targets in the range, in time order, with clashes marked.
 *
 * @param site the site
 * @param range the dates
 * @param limits the limits the verdicts used
 * @param targets the targets
 * @param predictions the minima, ordered by time of minimum (UTC)
 * @param notes remarks for the user (large timing errors, assumptions)
 */
public record Plan(Site site, DateRange range, ObservingLimits limits, List<PlanningTarget> targets,
        List<Prediction> predictions, List<String> notes) {

    public Plan {
        targets = List.copyOf(targets);
        predictions = List.copyOf(predictions);
        notes = List.copyOf(notes);
    }

    /** The same plan keeping only the observable minima (whole or partial). */
    public Plan observableOnly() {
        return new Plan(site, range, limits, targets,
                predictions.stream().filter(p -> p.verdict().observable()).toList(), notes);
    }
}

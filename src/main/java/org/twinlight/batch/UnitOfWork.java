package org.twinlight.batch;

/**
 * The work done for one target: target description in, result record out, result files written
 * into {@link BatchTarget#outputDir()} only. An implementation keeps no state between calls and
 * shares none with other targets (it may be called on several threads at once, or on other
 * machines), and writes the same files for the same target on every run.
 *
 * <p>It may throw {@link org.twinlight.BadInputException} (recorded as exit 2) or
 * {@link org.twinlight.WorkFailedException} (exit 1) instead of returning a failed result; the
 * runner records either and goes on with the next target.
 */
@FunctionalInterface
public interface UnitOfWork {
    /** Analyses one target, writing its results into its output folder. */
    TargetResult run(BatchTarget target);
}

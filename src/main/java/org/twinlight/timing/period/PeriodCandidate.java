package org.twinlight.timing.period;

/**
 * A trial period compared with the others, after its own refinement.
 *
 * @param refined the period refined from the data at this trial period, with its error and timing χ²
 * @param relation how it was chosen: its relation to the highest periodogram peak ("highest peak",
 *     "2 × highest peak", "highest peak / 2", "2/3 × highest peak", "3/2 × highest peak",
 *     "3 × highest peak") or "periodogram peak"
 * @param blsPower BLS signal residue SR at this period
 * @param sde robust signal detection efficiency of that power, (SR − median SR)/(1.4826·MAD SR)
 * @param pdmTheta Stellingwerf's Θ at the refined period with bins of a common width in days (about 1 for
 *     no signal, smaller is better)
 * @param consistent true when the data folded at this period are as coherent as at the best candidate
 *     (Θ and eclipse timings, see {@link CandidateComparison})
 * @param assessment the comparison in words
 */
public record PeriodCandidate(RefinedPeriod refined, String relation, double blsPower, double sde, double pdmTheta,
        boolean consistent, String assessment) {

    /** The refined period, days. */
    public double periodDays() {
        return refined.periodDays();
    }

    /** True when {@code otherDays} is an integer multiple (1, 2, 3, ...) of this period within {@code tol}. */
    boolean divides(double otherDays, double relTolerance) {
        double ratio = otherDays / periodDays();
        long k = Math.round(ratio);
        return k >= 1 && Math.abs(ratio - k) <= relTolerance * k;
    }
}

package org.twinlight.timing.period;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * The confirmation step: every candidate period is refined on its own and then compared with the others
 * on the same footing.
 *
 * <p>Candidates: the highest periodogram peak P₀ and its multiples 2P₀, P₀/2, 2P₀/3, 3P₀/2 and 3P₀ (an
 * eclipsing binary fills the periodogram with these), and the distinct peaks whose SDE reaches half of the
 * highest. Each is refined ({@link RefinedPeriod#at}) and then judged by
 * <ul>
 * <li>phase dispersion (Stellingwerf 1978, ApJ 224, 953) at its refined period, with bins of the same width
 * in days for all: a candidate is coherent when its Θ exceeds the lowest Θ by no more than
 * {@link #SIGNAL_SHARE} of the signal's share of the variance, 1 − Θ<sub>min</sub>, or by no more than
 * {@link #THETA_SIGMAS} times the statistical scatter of Θ, Θ·√(2/ν) (ν the degrees of freedom of the
 * pooled in-bin variance; the F-like ratio of two variances has a relative spread of about √(2/ν)), and
 * whose in-eclipse dispersion ({@link PhaseDispersion#eclipseDispersion}) exceeds the lowest by no more
 * than {@link #ECLIPSE_DISPERSION_EXCESS} (or the same statistical margin);</li>
 * <li>its eclipse timings: a period at which the timings scatter about a straight line by χ²ν above
 * {@link #TIMING_EXCLUSION_CHI2} (and 25 times the best candidate's) folds different eclipses
 * together.</li>
 * </ul>
 * The data folded at a true period are coherent, and so they are at every multiple of it; a shorter or
 * unrelated period folds eclipses onto out-of-eclipse data and becomes incoherent wherever the data cover
 * the times it predicts.
 */
final class CandidateComparison {
    /** Share of the signal variance a coherent candidate may lose (common practice, no source). */
    static final double SIGNAL_SHARE = 0.05;
    /** Statistical margin of Θ, in units of its relative spread √(2/ν) (common practice, no source). */
    static final double THETA_SIGMAS = 5;
    /**
     * How much the in-eclipse dispersion F ({@link PhaseDispersion#eclipseDispersion}) of a coherent
     * candidate may exceed the lowest, as a fraction (common practice, no source): eclipses folded onto
     * out-of-eclipse data raise it by factors, the noise by a few per cent.
     */
    static final double ECLIPSE_DISPERSION_EXCESS = 0.5;
    /**
     * Reduced χ² of the eclipse timings above which a candidate is excluded (and 25 times the best
     * candidate's): timings that scatter by √χ²ν ≥ 10 fold different eclipses together, while a true period
     * whose timing errors are somewhat optimistic (coarse cadence, correlated noise) reaches χ²ν of a few to
     * ten (common practice, no source).
     */
    static final double TIMING_EXCLUSION_CHI2 = 100;
    /** Peaks whose SDE reaches this share of the highest are compared too. */
    static final double PEAK_SHARE = 0.5;
    /** Most periodogram peaks compared besides the multiples of the highest. */
    static final int MAX_PEAKS = 6;

    private static final double[] MULTIPLES = {1, 2, 0.5, 2.0 / 3, 1.5, 3};
    private static final String[] RELATIONS = {"highest peak", "2 × highest peak", "highest peak / 2",
        "2/3 × highest peak", "3/2 × highest peak", "3 × highest peak"};

    private CandidateComparison() {
    }

    /** Bin width of Θ, days: a fifth of the detected eclipse, no finer than the data resolve. */
    static double binDays(SearchData data, Detection det) {
        return Math.max(data.resolutionDays(), 0.2 * det.dip().width() * det.topPeriodDays());
    }

    static Comparison compare(SearchData data, Detection det, SearchRange range, double scatter) {
        List<double[]> trials = new ArrayList<>();
        List<String> relations = new ArrayList<>();
        double p0 = det.topPeriodDays();
        for (int m = 0; m < MULTIPLES.length; m++) {
            double p = p0 * MULTIPLES[m];
            if (p >= range.minPeriodDays() / 2 && p <= data.baselineDays()) {
                addDistinct(trials, relations, p, RELATIONS[m], data, det);
            }
        }
        int added = 0;
        for (int k : det.peaks()) {
            double sde = det.sdeOf(det.power()[k]);
            if (added == MAX_PEAKS || !(sde >= PEAK_SHARE * det.sde())) {
                break;
            }
            if (addDistinct(trials, relations, 1 / det.grid().frequency(k), "periodogram peak", data, det)) {
                added++;
            }
        }
        PhaseDispersion pdm = new PhaseDispersion(data.timesDays(), data.flux());
        double binDays = binDays(data, det);
        List<RefinedPeriod> refined = new ArrayList<>();
        List<PhaseDispersion.Theta> thetas = new ArrayList<>();
        List<PhaseDispersion.Theta> dips = new ArrayList<>();
        for (double[] tr : trials) {
            RefinedPeriod r = RefinedPeriod.at(data, det.bls(), det.grid(), scatter, tr[0]);
            refined.add(r);
            thetas.add(pdm.thetaWithBinWidth(r.periodDays(), binDays));
            dips.add(pdm.eclipseDispersion(r.periodDays(), binDays, scatter));
        }
        double thetaMin = thetas.stream().mapToDouble(PhaseDispersion.Theta::theta).filter(Double::isFinite).min()
                .orElse(Double.NaN);
        // The lowest in-eclipse dispersion among the candidates that pass the Θ test: a period that folds
        // everything together has few or no eclipse bins, and its F says nothing.
        Coherence byTheta = new Coherence(pdm, binDays, scatter, thetaMin, Double.NaN);
        double dipMin = java.util.stream.IntStream.range(0, trials.size())
                .filter(i -> byTheta.thetaPasses(thetas.get(i))).mapToDouble(i -> dips.get(i).theta())
                .filter(Double::isFinite).min().orElse(Double.NaN);
        Coherence judge = new Coherence(pdm, binDays, scatter, thetaMin, dipMin);
        double chi2Min = refined.stream().filter(r -> r.timingReducedChiSquare().isPresent())
                .mapToDouble(r -> r.timingReducedChiSquare().getAsDouble()).min().orElse(1);
        double chi2Limit = Math.max(TIMING_EXCLUSION_CHI2, 25 * chi2Min);
        List<PeriodCandidate> out = new ArrayList<>();
        for (int i = 0; i < trials.size(); i++) {
            RefinedPeriod r = refined.get(i);
            double f = 1 / r.periodDays();
            double sr = det.bls().bestBox(f, det.grid().effectiveShortestDuration(f)).signalResidue();
            Coherence.Judgement j = judge.judge(thetas.get(i), dips.get(i));
            boolean timed = !r.timingsScatterBeyond(chi2Limit);
            String chi2Text = r.timingReducedChiSquare().isPresent()
                    ? String.format(Locale.ROOT, "timings χ²ν %.3g (√χ²ν %.2g)", r.timingReducedChiSquare().getAsDouble(),
                            Math.sqrt(r.timingReducedChiSquare().getAsDouble()))
                    : "too few eclipse timings for χ²";
            String assessment = j.text() + "; " + chi2Text + (timed ? "" : String.format(Locale.ROOT,
                    " > %.3g: the timings do not follow this period", chi2Limit));
            out.add(new PeriodCandidate(r, relations.get(i), sr, det.sdeOf(sr), thetas.get(i).theta(),
                    j.coherent() && timed, assessment));
        }
        return new Comparison(out, judge);
    }

    /** The candidates compared, and the judge that compared them (for further trial periods). */
    record Comparison(List<PeriodCandidate> candidates, Coherence coherence) {
    }

    /**
     * Whether the data folded at a period are as coherent as at the best candidate: Θ and the in-eclipse
     * dispersion against their lowest values over the candidates (see the class comment).
     */
    record Coherence(PhaseDispersion pdm, double binDays, double scatter, double thetaMin, double dipMin) {
        /** The verdict on one period with its numbers in words. */
        record Judgement(boolean coherent, String text) {
        }

        Judgement judge(double periodDays) {
            return judge(pdm.thetaWithBinWidth(periodDays, binDays), pdm.eclipseDispersion(periodDays, binDays,
                    scatter));
        }

        private double margin(PhaseDispersion.Theta th) {
            return Math.max(SIGNAL_SHARE * (1 - thetaMin),
                    THETA_SIGMAS * thetaMin * Math.sqrt(2.0 / Math.max(1, th.degreesOfFreedom())));
        }

        boolean thetaPasses(PhaseDispersion.Theta th) {
            return th.theta() - thetaMin <= margin(th);
        }

        Judgement judge(PhaseDispersion.Theta th, PhaseDispersion.Theta dip) {
            double margin = margin(th);
            double dipLimit = dipMin * Math.max(1 + ECLIPSE_DISPERSION_EXCESS,
                    1 + THETA_SIGMAS * Math.sqrt(2.0 / Math.max(1, dip.degreesOfFreedom())));
            boolean coherent = th.theta() - thetaMin <= margin && !(dip.theta() > dipLimit);
            return new Judgement(coherent, String.format(Locale.ROOT, "Θ %.4f (lowest %.4f, allowed up to %.4f);"
                    + " in-eclipse dispersion F %.3g (lowest %.3g, allowed up to %.3g)%s", th.theta(), thetaMin,
                    thetaMin + margin, dip.theta(), dipMin, dipLimit,
                    coherent ? "" : ": folds eclipses onto out-of-eclipse data"));
        }
    }

    /** Adds a trial period unless one within the periodogram's resolution is there already. */
    private static boolean addDistinct(List<double[]> trials, List<String> relations, double p, String relation,
            SearchData data, Detection det) {
        double tolerance = 0.5 * det.dip().width() / data.baselineDays();
        for (double[] tr : trials) {
            if (Math.abs(1 / tr[0] - 1 / p) < tolerance * Math.min(1, det.topPeriodDays() / p)) {
                return false;
            }
        }
        trials.add(new double[] {p});
        relations.add(relation);
        return true;
    }
}

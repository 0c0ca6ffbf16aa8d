package org.twinlight.fit;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.twinlight.WorkFailedException;
import org.twinlight.eclipse.BandValues;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.photometry.LightCurve;
import org.twinlight.photometry.RobustStatistics;

/**
 * Starting values of the geometry from the folded light curve, for a known period and epoch: the
 * eclipses' depths, full widths and the secondary's phase give
 * <ul>
 * <li>e cos ω ≈ (π/2)(φ₂ − ½) from the secondary's phase φ₂ (first order in e; Sterne 1939;
 * Kallrath &amp; Milone 2009, <i>Eclipsing Binary Stars</i>, §3.1, from memory);</li>
 * <li>e sin ω ≈ (w₂ − w₁)/(w₂ + w₁) from the full widths w₁, w₂ of the primary and secondary
 * eclipse (Kopal 1959, <i>Close Binary Systems</i>, from memory; the sign follows this project's
 * convention, checked against its own orbit in the tests);</li>
 * <li>r₁ + r₂ ≈ sin(π w̄) with w̄ the mean full width in phase
 * (contacts at a separation r₁ + r₂ for a central eclipse of a circular orbit);</li>
 * <li>the surface-brightness ratio J ≈ d₂/d₁ (equal eclipsed areas in a circular orbit) and the radius
 * ratio from the primary depth d₁ = k²/(1 + k²J) of a central eclipse of uniform discs;</li>
 * <li>the inclination and a refined radius ratio from the eclipse shape: the pair whose model (with
 * the model file's limb darkening) comes closest to the binned folded curve on a small grid of
 * impact parameters from 0 to r₁ + r₂ and of ratios around the depth's estimate.</li>
 * </ul>
 * These are first guesses for the least-squares fit, not results: limb darkening deepens and
 * partial eclipses shallow the depths.
 *
 * @param secondaryPhase phase of the secondary minimum (0.5 when none is seen)
 * @param secondarySeen whether a secondary eclipse stands out of the noise
 * @param primaryDepth depth of the primary eclipse, normalised flux
 * @param secondaryDepth depth of the secondary (0 when not seen)
 * @param primaryWidth full width of the primary, phase
 * @param secondaryWidth full width of the secondary, phase (the primary's when not seen)
 * @param flatBottomed whether an eclipse has a flat bottom (total eclipse)
 * @param eCosOmega estimate of e cos ω
 * @param eSinOmega estimate of e sin ω
 * @param sumOfRadii estimate of r₁ + r₂
 * @param radiusRatio estimate of k = r₂/r₁
 * @param inclinationDeg estimate of i
 * @param surfaceBrightnessRatio estimate of J
 */
public record StartingValues(double secondaryPhase, boolean secondarySeen, double primaryDepth,
        double secondaryDepth, double primaryWidth, double secondaryWidth, boolean flatBottomed, double eCosOmega,
        double eSinOmega, double sumOfRadii, double radiusRatio, double inclinationDeg,
        double surfaceBrightnessRatio) {

    private static final int MAX_BINS = 400;
    private static final int MIN_PER_BIN = 3;
    /** A secondary must stand this many bin-noise σ below the continuum to count as seen. */
    private static final double SECONDARY_SIGMAS = 5;

    /**
     * Estimates from one light curve folded on the period and epoch of {@code model}.
     *
     * @throws WorkFailedException when no primary eclipse stands out at phase 0
     */
    public static StartingValues estimate(LightCurve lc, BinaryParameters model) {
        double periodDays = model.periodDays();
        double epochDays = model.epochDays();
        Folded f = Folded.of(lc, periodDays, epochDays);
        int p = f.deepestWithin(0, 0.1);
        if (p < 0 || 1 - f.flux[p] < SECONDARY_SIGMAS * f.binSigma) {
            throw new WorkFailedException(String.format(Locale.ROOT, "no primary eclipse stands out at phase 0 of the "
                    + "folded data (period %.7f d, epoch %.5f): starting values cannot be estimated; check period "
                    + "and epoch with the period and minima commands", periodDays, epochDays));
        }
        double d1 = 1 - f.flux[p];
        double[] w1 = f.widthAround(p, d1);
        double phase1 = f.phase[p];
        int s = f.deepestOutside(phase1, w1[0], w1[1]);
        boolean seen = s >= 0 && 1 - f.flux[s] >= SECONDARY_SIGMAS * f.binSigma;
        double d2 = seen ? 1 - f.flux[s] : 0;
        double[] w2 = seen ? f.widthAround(s, d2) : w1;
        double width1 = w1[0] + w1[1];
        double width2 = w2[0] + w2[1];
        double phase2 = seen ? f.phase[s] - phase1 : 0.5;
        phase2 -= Math.floor(phase2);
        double eCos = 0.5 * Math.PI * (phase2 - 0.5);
        double eSin = seen ? (width2 - width1) / (width2 + width1) : 0;
        double e = Math.hypot(eCos, eSin);
        if (e > 0.8) {
            eCos *= 0.8 / e;
            eSin *= 0.8 / e;
        }
        double meanWidth = seen ? 0.5 * (width1 + width2) : width1;
        double sum = Math.min(0.8 * (1 - Math.hypot(eCos, eSin)), Math.max(0.01, Math.sin(Math.PI * meanWidth)));
        double j = seen ? Math.min(5, Math.max(0.02, d2 / d1)) : 0.1;
        double k2 = d1 / Math.max(0.05, 1 - Math.min(d1 * j, 0.95));
        double k = Math.min(1, Math.max(0.2, Math.sqrt(k2)));
        // the occultation of the smaller star is the flat one; the transit is curved by limb darkening
        boolean flat = f.flatBottom(p, d1) || seen && f.flatBottom(s, d2);
        double eNow = Math.hypot(eCos, eSin);
        double omega = eNow > 0 ? Math.toDegrees(Math.atan2(eSin, eCos)) : model.omegaDeg();
        BinaryParameters guess = model.withRadii(0.01, 0.01).withEccentricityOmega(eNow, omega).withSurfaceBrightnessRatio(j);
        double[] best = f.bestShape(guess, sum, k, flat);
        return new StartingValues(phase2, seen, d1, d2, width1, width2, flat, eCos, eSin, sum, best[1],
                best[0], j);
    }

    /**
     * Starting values for a fit: the model's period, epoch, limb darkening and third light; of the
     * estimated values only those of free parameters are put in (radii, inclination, eccentricity
     * and ω, and the surface-brightness ratio of each band from its own data), so that a fixed
     * value stays what the model file says.
     *
     * @param bandEstimates per band, the estimate from that band's data (the first one also gives
     *     the geometry)
     * @param free names of the free parameters
     */
    public static ModelFile apply(ModelFile model, Map<String, StartingValues> bandEstimates,
            java.util.Set<String> free) {
        StartingValues g = bandEstimates.values().iterator().next();
        BinaryParameters c = model.common();
        BinaryParameters geometry = c;
        if (free.contains("eccentricity") || free.contains("omega")) {
            double e = free.contains("eccentricity") ? Math.hypot(g.eCosOmega, g.eSinOmega) : c.eccentricity();
            double w = Math.hypot(g.eCosOmega, g.eSinOmega) > 0 && free.contains("omega")
                    ? Math.toDegrees(Math.atan2(g.eSinOmega, g.eCosOmega)) : c.omegaDeg();
            geometry = geometry.withRadii(0.01, 0.01).withEccentricityOmega(e, w);
        }
        double r1 = free.contains("radius1") ? g.sumOfRadii / (1 + g.radiusRatio) : c.radius1();
        double r2 = free.contains("radius2") ? g.sumOfRadii - g.sumOfRadii / (1 + g.radiusRatio) : c.radius2();
        geometry = geometry.withRadii(r1, r2);
        if (free.contains("inclination")) {
            geometry = geometry.withInclinationDeg(g.inclinationDeg);
        }
        boolean brightness = free.contains("surfaceBrightnessRatio");
        if (model.bands().isEmpty() && bandEstimates.size() == 1) {
            return ModelFile.of(brightness ? geometry.withSurfaceBrightnessRatio(g.surfaceBrightnessRatio) : geometry);
        }
        Map<String, BandValues> bands = new LinkedHashMap<>(model.bands());
        if (brightness) {
            for (Map.Entry<String, StartingValues> b : bandEstimates.entrySet()) {
                BandValues old = bands.get(b.getKey());
                bands.put(b.getKey(), new BandValues(b.getValue().surfaceBrightnessRatio,
                        old == null ? null : old.thirdLight(), old == null ? null : old.limbDarkening1(),
                        old == null ? null : old.limbDarkening2()));
            }
        }
        return new ModelFile(brightness && model.commonComplete()
                ? geometry.withSurfaceBrightnessRatio(g.surfaceBrightnessRatio) : geometry, bands,
                model.commonComplete());
    }

    /** What was estimated, for notes. */
    public String describe() {
        return String.format(Locale.ROOT, "starting values from the data: primary depth %.4f and full width %.4f in "
                + "phase%s; e cos ω = %.4f, e sin ω = %.4f, r₁ + r₂ = %.4f, k = %.3f, i = %.2f° (%s), J = %.3f",
                primaryDepth, primaryWidth, secondarySeen ? String.format(Locale.ROOT, ", secondary depth %.4f, width "
                        + "%.4f at phase %.4f", secondaryDepth, secondaryWidth, secondaryPhase)
                        : ", no secondary seen (circular orbit assumed)", eCosOmega, eSinOmega, sumOfRadii, radiusRatio,
                inclinationDeg, flatBottomed ? "a flat-bottomed eclipse" : "no flat-bottomed eclipse", surfaceBrightnessRatio);
    }

    /** The light curve folded and binned in phase (medians), normalised by its median. */
    private record Folded(double[] phase, double[] flux, double binSigma) {

        static Folded of(LightCurve lc, double period, double epoch) {
            double[] t = lc.timesDays();
            double[] y = lc.fluxes();
            double norm = RobustStatistics.median(y.clone());
            int bins = Math.max(20, Math.min(MAX_BINS, t.length / (2 * MIN_PER_BIN)));
            List<List<Double>> perBin = new ArrayList<>();
            for (int b = 0; b < bins; b++) {
                perBin.add(new ArrayList<>());
            }
            for (int i = 0; i < t.length; i++) {
                double ph = (t[i] - epoch) / period;
                ph -= Math.floor(ph);
                perBin.get(Math.min(bins - 1, (int) (ph * bins))).add(y[i] / norm);
            }
            List<double[]> kept = new ArrayList<>();
            List<Double> spreads = new ArrayList<>();
            for (int b = 0; b < bins; b++) {
                List<Double> v = perBin.get(b);
                if (v.size() < MIN_PER_BIN) {
                    continue;
                }
                double[] a = v.stream().mapToDouble(Double::doubleValue).toArray();
                kept.add(new double[] {(b + 0.5) / bins, RobustStatistics.median(a.clone())});
                spreads.add(RobustStatistics.madSigma(a) / Math.sqrt(a.length));
            }
            double[] ph = kept.stream().mapToDouble(a -> a[0]).toArray();
            double[] fl = kept.stream().mapToDouble(a -> a[1]).toArray();
            double sigma = RobustStatistics.median(spreads.stream().mapToDouble(Double::doubleValue).toArray());
            // the binned curve's own noise, from bin-to-bin differences, guards against bins too coarse for it
            sigma = Math.max(sigma, RobustStatistics.pointToPointSigma(fl));
            return new Folded(ph, fl, Math.max(sigma, 1e-6));
        }

        int deepestWithin(double centre, double half) {
            int best = -1;
            for (int i = 0; i < phase.length; i++) {
                double d = phase[i] - centre;
                d -= Math.rint(d);
                if (Math.abs(d) <= half && (best < 0 || flux[i] < flux[best])) {
                    best = i;
                }
            }
            return best;
        }

        /** The deepest bin outside [centre − left − margin, centre + right + margin]. */
        int deepestOutside(double centre, double left, double right) {
            int best = -1;
            double margin = 0.5 * (left + right);
            for (int i = 0; i < phase.length; i++) {
                double d = phase[i] - centre;
                d -= Math.rint(d);
                boolean inside = d >= -(left + margin) && d <= right + margin;
                if (!inside && (best < 0 || flux[i] < flux[best])) {
                    best = i;
                }
            }
            return best;
        }

        /**
         * Half-widths (left, right) in phase of the eclipse at bin {@code at}: where the flux comes
         * back above 1 − max(2% of the depth, 2 σ), interpolated between bins.
         */
        double[] widthAround(int at, double depth) {
            double level = 1 - Math.max(0.02 * depth, 2 * binSigma);
            return new double[] {walk(at, -1, level), walk(at, 1, level)};
        }

        private double walk(int at, int dir, double level) {
            int n = phase.length;
            int i = at;
            for (int steps = 0; steps < n / 2; steps++) {
                int next = Math.floorMod(i + dir, n);
                if (flux[next] >= level) {
                    double a = flux[i];
                    double b = flux[next];
                    double frac = b == a ? 0 : (level - a) / (b - a);
                    double dp = phase[next] - phase[i];
                    dp -= Math.rint(dp);
                    double edge = phase[i] + frac * dp - phase[at];
                    return Math.abs(edge - Math.rint(edge));
                }
                i = next;
            }
            return 0.25;
        }

        /**
         * {inclination, radius ratio} of the grid point whose model is closest (least squares) to
         * the binned curve, the out-of-eclipse level scaled out.
         */
        double[] bestShape(BinaryParameters guess, double sum, double k0, boolean flat) {
            double bestChi2 = Double.POSITIVE_INFINITY;
            double[] best = {90, k0};
            int steps = 16;
            for (double kf : new double[] {0.8, 0.9, 1.0, 1.1, 1.25}) {
                double k = Math.min(1.0, k0 * kf);
                double r1 = sum / (1 + k);
                for (int a = 0; a < steps; a++) {
                    double b = (a + 0.5) / steps * sum;
                    double incl = Math.toDegrees(Math.acos(Math.min(0.99, b)));
                    BinaryParameters p;
                    try {
                        p = guess.withRadii(r1, sum - r1).withInclinationDeg(incl);
                    } catch (IllegalArgumentException outside) {
                        continue;
                    }
                    org.twinlight.eclipse.BinaryModel m = new org.twinlight.eclipse.BinaryModel(p);
                    double syy = 0;
                    double smm = 0;
                    double sym = 0;
                    for (int i = 0; i < phase.length; i++) {
                        double mf = m.flux(p.epochDays() + phase[i] * p.periodDays());
                        syy += flux[i] * flux[i];
                        smm += mf * mf;
                        sym += flux[i] * mf;
                    }
                    double chi2 = syy - sym * sym / smm;
                    if (chi2 < bestChi2) {
                        bestChi2 = chi2;
                        best = new double[] {incl, k};
                    }
                }
            }
            return best;
        }

        /** Whether the bins within 3σ of the minimum span a fifth or more of the eclipse. */
        boolean flatBottom(int at, double depth) {
            double[] w = widthAround(at, depth);
            int within = 0;
            int total = 0;
            for (int i = 0; i < phase.length; i++) {
                double d = phase[i] - phase[at];
                d -= Math.rint(d);
                if (d >= -w[0] && d <= w[1]) {
                    total++;
                    within += flux[i] <= flux[at] + 3 * binSigma ? 1 : 0;
                }
            }
            return total > 0 && within >= Math.max(2, 0.2 * total);
        }
    }

    /**
     * Per band, the estimate from that band's largest light curve with the model's period, epoch
     * and limb darkening, bands in order of first use.
     */
    public static Map<String, StartingValues> fromData(List<FitData> data, ModelFile model) {
        Map<String, FitData> largest = new LinkedHashMap<>();
        for (FitData d : data) {
            FitData old = largest.get(d.band());
            if (old == null || d.lightCurve().size() > old.lightCurve().size()) {
                largest.put(d.band(), d);
            }
        }
        Map<String, StartingValues> out = new LinkedHashMap<>();
        largest.forEach((band, d) -> out.put(band, estimate(d.lightCurve(), model.covers(band)
                ? model.forBand(band) : model.common())));
        return out;
    }

}

package org.twinlight.fit;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.eclipse.SyntheticLightCurve;
import org.twinlight.photometry.LightCurve;
import org.twinlight.photometry.ValueKind;
import org.twinlight.time.TimeScale;

/**
 * Synthetic light curves with known truth for the calibration of the fit's errors: the
 * project's own model, a ground-like run of nights with gaps, white noise and optionally noise
 * correlated in time (a first-order autoregressive process with an e-folding time τ: the
 * correlation of two points Δt apart is exp(−Δt/τ)). Each run fits the curve, computes the noise
 * diagnostics and returns, per free parameter, the truth in units of the covariance error and of
 * the error the tool says to quote.
 */
public final class CalibrationRuns {

    /** Free parameters of every run. */
    public static final List<String> FREE = List.of("epoch", "radius1", "radius2", "inclination",
            "surfaceBrightnessRatio");

    /** A demo system (invented): which eclipse geometry. */
    public enum Geometry {
        /** i = 89.6°: the smaller star passes wholly inside the larger's disc (total/annular). */
        TOTAL(89.6),
        /** i = 86.5°: the discs overlap only in part. */
        PARTIAL(86.5);

        final double inclinationDeg;

        Geometry(double inclinationDeg) {
            this.inclinationDeg = inclinationDeg;
        }

        /** The system's true parameters. */
        public BinaryParameters truth() {
            return new BinaryParameters(2.8731, 2460000.4123, 0.118, 0.081, inclinationDeg, 0, 90, 0.58, 0,
                    LimbDarkening.quadratic(0.40, 0.22), LimbDarkening.quadratic(0.45, 0.20), 0, 1);
        }
    }

    /**
     * The noise added to the model.
     *
     * @param whitePpm σ of the white part, ppm of the out-of-eclipse flux
     * @param redPpm σ of the correlated part, ppm (0: none)
     * @param redMinutes its e-folding time, minutes
     */
    public record Noise(double whitePpm, double redPpm, double redMinutes) {
        /** 2000 ppm white. */
        public static final Noise WHITE = new Noise(2000, 0, 0);
        /** 2000 ppm white plus 2000 ppm (about 2 mmag) correlated over 30 min. */
        public static final Noise RED = new Noise(2000, 2000, 30);
    }

    /**
     * One run's outcome per free parameter.
     *
     * @param deviation fit − truth
     * @param covarianceSigma the covariance error scaled by χ²ν
     * @param noise the noise diagnostics
     */
    public record Outcome(Map<String, Double> deviation, Map<String, Double> covarianceSigma, NoiseReport noise) {

        /** (fit − truth)/σ_cov. */
        public Map<String, Double> covariance() {
            return pulls((name, sigma) -> sigma);
        }

        /** (fit − truth)/σ_quote, σ_quote the error the noise report says to quote. */
        public Map<String, Double> quoted() {
            return pulls(noise::quoted);
        }

        /** (fit − truth)/σ for the error σ = rule(name, σ_cov). */
        public Map<String, Double> pulls(java.util.function.BiFunction<String, Double, Double> rule) {
            Map<String, Double> m = new LinkedHashMap<>();
            deviation.forEach((name, d) -> m.put(name, d / rule.apply(name, covarianceSigma.get(name))));
            return m;
        }

        public double beta() {
            return noise.beta();
        }
    }

    private CalibrationRuns() {
    }

    /** Eleven nights of 8 h at a 3-minute cadence (about 1,750 points, three or four eclipses of each kind). */
    public static LightCurve observe(Geometry g, Noise noise, long seed) {
        return observe(g, noise, seed, 1);
    }

    /**
     * As {@link #observe(Geometry, Noise, long)}, the errors stated {@code statedErrorFactor} times
     * the white noise's true σ (0.5: stated 2× too small).
     */
    public static LightCurve observe(Geometry g, Noise noise, long seed, double statedErrorFactor) {
        double[] t = SyntheticLightCurve.regularTimes(2460000.0, 2460011.0, 3.0, List.of(), new double[] {0.33, 0.67});
        double[] f = new BinaryModel(g.truth()).flux(t);
        double[] e = new double[t.length];
        Random random = new Random(seed);
        double white = noise.whitePpm() * 1e-6;
        double red = noise.redPpm() * 1e-6;
        double r = red * random.nextGaussian();
        for (int i = 0; i < t.length; i++) {
            if (i > 0 && red > 0) {
                double rho = Math.exp(-(t[i] - t[i - 1]) * 1440 / noise.redMinutes());
                r = rho * r + Math.sqrt(1 - rho * rho) * red * random.nextGaussian();
            }
            f[i] += white * random.nextGaussian() + (red > 0 ? r : 0);
            // the errors state the white part only, as a photometric pipeline would
            e[i] = white * statedErrorFactor;
        }
        return new LightCurve("calibration-" + seed, "V", TimeScale.BJD_TDB, ValueKind.FLUX, t, f, e, Map.of());
    }

    /** The fit problem of one synthetic curve, started near the truth. */
    public static FitProblem problem(Geometry g, Noise noise, long seed) {
        return problem(g, noise, seed, 1);
    }

    /** The fit problem of one synthetic curve with its errors stated {@code statedErrorFactor} × the true white σ. */
    public static FitProblem problem(Geometry g, Noise noise, long seed, double statedErrorFactor) {
        BinaryParameters truth = g.truth();
        ModelFile start = ModelFile.of(truth.withRadii(truth.radius1() * 1.02, truth.radius2() * 0.98)
                .withInclinationDeg(Math.min(89.9, truth.inclinationDeg() - 0.2)).withEpochDays(truth.epochDays() + 0.0005));
        return FitProblem.of(start, List.of(new FitData(observe(g, noise, seed, statedErrorFactor), "V")),
                FitSettings.defaults().withFree(new LinkedHashSet<>(FREE)));
    }

    /** Fits one synthetic curve (from a start near the truth) and compares with the truth. */
    public static Outcome run(Geometry g, Noise noise, long seed, int maxShifts) {
        BinaryParameters truth = g.truth();
        FitProblem problem = problem(g, noise, seed);
        FitResult r = EclipseFitter.optimize(problem);
        NoiseReport report = NoiseDiagnostics.of(problem, r, maxShifts);
        Map<String, Double> deviation = new LinkedHashMap<>();
        Map<String, Double> sigma = new LinkedHashMap<>();
        for (String name : FREE) {
            Estimate e = r.get(name);
            deviation.put(name, e.value() - truthValue(truth, name));
            sigma.put(name, e.uncertainty());
        }
        return new Outcome(deviation, sigma, report);
    }

    public static double truthValue(BinaryParameters p, String name) {
        return switch (name) {
            case "epoch" -> p.epochDays();
            case "radius1" -> p.radius1();
            case "radius2" -> p.radius2();
            case "inclination" -> p.inclinationDeg();
            case "surfaceBrightnessRatio" -> p.surfaceBrightnessRatio();
            default -> throw new IllegalArgumentException(name);
        };
    }

    /** Fraction of the values within ±limit. */
    public static double coverage(List<Double> pulls, double limit) {
        return pulls.stream().filter(p -> Math.abs(p) < limit).count() / (double) pulls.size();
    }

    /** Sample standard deviation. */
    public static double spread(List<Double> v) {
        double mean = v.stream().mapToDouble(Double::doubleValue).average().orElseThrow();
        return Math.sqrt(v.stream().mapToDouble(d -> (d - mean) * (d - mean)).sum() / (v.size() - 1));
    }

    /** All pulls of several outcomes, per parameter. */
    public static Map<String, List<Double>> byParameter(List<Outcome> runs, boolean quoted) {
        return byParameter(runs.stream().map(o -> quoted ? o.quoted() : o.covariance()).toList());
    }

    /** Pulls of several runs, per parameter. */
    public static Map<String, List<Double>> byParameter(List<Map<String, Double>> runs) {
        Map<String, List<Double>> m = new LinkedHashMap<>();
        for (Map<String, Double> o : runs) {
            o.forEach((k, v) -> m.computeIfAbsent(k, x -> new ArrayList<>()).add(v));
        }
        return m;
    }
}

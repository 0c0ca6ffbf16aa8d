package org.twinlight.bench;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import org.twinlight.WorkFailedException;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.eclipse.SyntheticLightCurve;
import org.twinlight.fit.EclipseFitter;
import org.twinlight.fit.Estimate;
import org.twinlight.fit.FitData;
import org.twinlight.fit.FitResult;
import org.twinlight.fit.FitSettings;
import org.twinlight.fit.StartingValues;
import org.twinlight.photometry.LightCurve;
import org.twinlight.time.TimeScale;

/**
 * The large versions of the fit's injection tests, over many noise seeds, printing the tables kept
 * in {@code docs/fit-injection.md}: the model-adequacy note for unmodelled third light, wrong limb
 * darkening and a correct model; edge-on and near-edge-on totals (limits and radius pulls);
 * eccentric orbits from circular starts with starting values from the data. Run with
 * {@code java -cp target/classes:target/test-classes:$(deps) org.twinlight.bench.FitInjectionBench [SEEDS [adequacy,edge,eccentric]]}.
 */
public final class FitInjectionBench {
    private static final BinaryParameters DETACHED = new BinaryParameters(3.0712, 2460600.4417, 0.105, 0.072, 88.4,
            0, 90, 0.62, 0, LimbDarkening.quadratic(0.42, 0.21), LimbDarkening.quadratic(0.50, 0.19), 0, 1);

    private FitInjectionBench() {
    }

    public static void main(String[] args) {
        int seeds = args.length > 0 ? Integer.parseInt(args[0]) : 100;
        String parts = args.length > 1 ? args[1] : "adequacy,edge,eccentric";
        if (parts.contains("adequacy")) {
            adequacy(seeds);
        }
        if (parts.contains("edge")) {
            edgeOn(seeds);
        }
        if (parts.contains("eccentric")) {
            eccentric(seeds);
        }
    }

    private static LightCurve observe(BinaryParameters p, double days, double ppm, long seed) {
        double[] t = SyntheticLightCurve.regularTimes(2460600.0, 2460600.0 + days, 2, List.of(), null);
        return SyntheticLightCurve.observe(new BinaryModel(p), t, ppm, seed, "T", "T", TimeScale.BJD_TDB);
    }

    private static void adequacy(int seeds) {
        BinaryParameters wrongLd = DETACHED.withLimbDarkening(LimbDarkening.quadratic(0.52, 0.21),
                LimbDarkening.quadratic(0.60, 0.19));
        String[] names = {"third light 0.25 in the data, fixed at 0", "limb-darkening a off by 0.1", "correct model"};
        System.out.println("| case (27 d at 2 min, 1000 ppm, " + seeds + " seeds) | adequacy note raised | median χ²ν |");
        System.out.println("|---|---|---|");
        for (int c = 0; c < 3; c++) {
            int raised = 0;
            List<Double> chi = new ArrayList<>();
            for (long seed = 1; seed <= seeds; seed++) {
                BinaryParameters truth = c == 0 ? DETACHED.withThirdLight(0.25) : DETACHED;
                BinaryParameters assumed = c == 1 ? wrongLd : DETACHED;
                FitResult r = EclipseFitter.fit(ModelFile.of(assumed.withRadii(0.11, 0.068).withInclinationDeg(87.8)),
                        List.of(new FitData(observe(truth, 27, 1000, 1000 + seed), "T")), FitSettings.defaults());
                raised += r.adequacy().describesData() ? 0 : 1;
                chi.add(r.reducedChi2());
            }
            chi.sort(null);
            System.out.printf(Locale.ROOT, "| %s | %d / %d (%.0f%%) | %.4f |%n", names[c], raised, seeds,
                    100.0 * raised / seeds, chi.get(chi.size() / 2));
        }
    }

    private static void edgeOn(int seeds) {
        BinaryParameters base = new BinaryParameters(2.317, 2460500.3141, 0.118, 0.081, 90.0, 0, 90, 0.58, 0,
                LimbDarkening.quadratic(0.40, 0.22), LimbDarkening.quadratic(0.48, 0.20), 0, 1);
        System.out.println();
        System.out.println("| true i (7 d at 4 min, 1000 ppm, " + seeds + " seeds) | reported as a limit | truth "
                + "inside (95% limit, or 3σ) | r₁ pull mean, sd | r₂ pull mean, sd | failed fits |");
        System.out.println("|---|---|---|---|---|---|");
        for (double incl : new double[] {88.5, 89.0, 89.5, 90.0}) {
            int limits = 0;
            int inside = 0;
            int failed = 0;
            List<Double> p1 = new ArrayList<>();
            List<Double> p2 = new ArrayList<>();
            for (long seed = 1; seed <= seeds; seed++) {
                BinaryParameters truth = base.withInclinationDeg(incl);
                LightCurve lc = SyntheticLightCurve.observe(new BinaryModel(truth),
                        SyntheticLightCurve.regularTimes(2460500.0, 2460507.0, 4, List.of(), null), 1000, 2000 + seed,
                        "V", "V", TimeScale.BJD_TDB);
                FitResult r;
                try {
                    r = EclipseFitter.fit(ModelFile.of(truth.withInclinationDeg(87.5).withRadii(0.125, 0.076)),
                            List.of(new FitData(lc, "V")), FitSettings.defaults());
                } catch (WorkFailedException e) {
                    failed++;
                    continue;
                }
                Estimate i = r.get("inclination");
                if (i.isLimit()) {
                    limits++;
                    inside += i.limit().value95() <= incl ? 1 : 0;
                } else {
                    inside += Math.abs(i.value() - incl) <= 3 * i.uncertainty() ? 1 : 0;
                }
                p1.add((r.get("radius1").value() - truth.radius1()) / r.get("radius1").uncertainty());
                p2.add((r.get("radius2").value() - truth.radius2()) / r.get("radius2").uncertainty());
            }
            System.out.printf(Locale.ROOT, "| %.1f° | %d / %d | %d / %d | %s | %s | %d |%n", incl, limits, seeds, inside,
                    seeds - failed, meanSd(p1), meanSd(p2), failed);
        }
    }

    private static void eccentric(int seeds) {
        BinaryParameters truth = new BinaryParameters(2.317, 2460500.3141, 0.118, 0.081, 88.7, 0.08, 62, 0.58, 0,
                LimbDarkening.quadratic(0.40, 0.22), LimbDarkening.quadratic(0.48, 0.20), 0, 1);
        List<String> free = List.of("epoch", "radius1", "radius2", "inclination", "surfaceBrightnessRatio",
                "eccentricity", "omega");
        int recovered = 0;
        int failed = 0;
        List<Double> pe = new ArrayList<>();
        List<Double> pw = new ArrayList<>();
        for (long seed = 1; seed <= seeds; seed++) {
            LightCurve lc = SyntheticLightCurve.observe(new BinaryModel(truth),
                    SyntheticLightCurve.regularTimes(2460500.0, 2460512.0, 4, List.of(), null), 1000, 3000 + seed,
                    "V", "V", TimeScale.BJD_TDB);
            List<FitData> data = List.of(new FitData(lc, "V"));
            ModelFile circular = ModelFile.of(truth.withEccentricityOmega(0, 90).withRadii(0.14, 0.07)
                    .withInclinationDeg(86));
            try {
                FitResult r = EclipseFitter.fit(StartingValues.apply(circular, StartingValues.fromData(data, circular),
                        new LinkedHashSet<>(free)),
                        data, FitSettings.defaults().withFree(new LinkedHashSet<>(free)));
                double a = (r.get("eccentricity").value() - 0.08) / r.get("eccentricity").uncertainty();
                double b = (r.get("omega").value() - 62) / r.get("omega").uncertainty();
                pe.add(a);
                pw.add(b);
                recovered += Math.abs(a) < 4 && Math.abs(b) < 4 ? 1 : 0;
            } catch (WorkFailedException e) {
                failed++;
            }
        }
        System.out.println();
        System.out.println("| eccentric orbit e = 0.08, ω = 62° from a circular start (--start auto), " + seeds
                + " seeds | e and ω within 4σ | e pull mean, sd | ω pull mean, sd | failed fits |");
        System.out.println("|---|---|---|---|---|");
        System.out.printf(Locale.ROOT, "| 12 d at 4 min, 1000 ppm | %d / %d | %s | %s | %d |%n", recovered, seeds,
                meanSd(pe), meanSd(pw), failed);
    }

    private static String meanSd(List<Double> v) {
        if (v.isEmpty()) {
            return "–";
        }
        double m = v.stream().mapToDouble(Double::doubleValue).average().orElse(Double.NaN);
        double s = Math.sqrt(v.stream().mapToDouble(x -> (x - m) * (x - m)).sum() / Math.max(1, v.size() - 1));
        return String.format(Locale.ROOT, "%+.2f, %.2f", m, s);
    }
}

package org.twinlight.bench;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.twinlight.fit.CalibrationRuns;
import org.twinlight.fit.CalibrationRuns.Geometry;
import org.twinlight.fit.CalibrationRuns.Noise;
import org.twinlight.fit.CalibrationRuns.Outcome;
import org.twinlight.fit.NoiseDiagnostics;

/**
 * Candidate rules for the error to quote, compared on the same synthetic runs as
 * {@link CalibrationBench} (other seeds): covariance alone, covariance × β (median or largest
 * β_w, over all widths or from the ingress duration up), the permutation spread alone, and the
 * larger of the two. The table in docs/uncertainties.md that chose the rule comes from here. Run
 * with {@code java -cp target/classes:target/test-classes:$(deps) org.twinlight.bench.QuoteRuleBench SEEDS [red|all]}.
 */
public final class QuoteRuleBench {
    private QuoteRuleBench() {
    }

    public static void main(String[] args) {
        int seeds = Integer.parseInt(args[0]);
        String noises = args.length > 1 ? args[1] : "red";
        for (Geometry g : Geometry.values()) {
            for (Noise noise : noises.equals("red") ? List.of(Noise.RED) : List.of(Noise.WHITE, Noise.RED)) {
                List<Outcome> runs = new ArrayList<>();
                for (long seed = 1; seed <= seeds; seed++) {
                    runs.add(CalibrationRuns.run(g, noise, 5000 + 1000 * g.ordinal() + seed, NoiseDiagnostics.MAX_SHIFTS));
                }
                double ingress = ingressMinutes(g.truth());
                for (String rule : List.of("covariance", "cov x median", "cov x max", "perm", "max(cov x median, perm)",
                        "max(cov x max, perm)", "cov x median[ingress..]", "max(cov x median[ingress..], perm)",
                        "max(cov x max[ingress..], perm)")) {
                    List<Map<String, Double>> pulls = new ArrayList<>();
                    for (Outcome o : runs) {
                        double med = Math.max(1, o.beta());
                        double max = Math.max(1, o.noise().betaByBinMinutes().values().stream()
                                .filter(Double::isFinite).mapToDouble(Double::doubleValue).max().orElse(1));
                        double[] longer = o.noise().betaByBinMinutes().entrySet().stream()
                                .filter(e -> e.getKey() >= 0.8 * ingress && Double.isFinite(e.getValue()))
                                .mapToDouble(e -> e.getValue()).sorted().toArray();
                        double medL = longer.length == 0 ? med : Math.max(1, longer[longer.length / 2]);
                        double maxL = longer.length == 0 ? med : Math.max(1, longer[longer.length - 1]);
                        pulls.add(o.pulls((n, s) -> switch (rule) {
                            case "cov x median[ingress..]" -> s * medL;
                            case "max(cov x median[ingress..], perm)" -> Math.max(s * medL, o.noise().permutationSigma().get(n));
                            case "max(cov x max[ingress..], perm)" -> Math.max(s * maxL, o.noise().permutationSigma().get(n));
                            case "covariance" -> s;
                            case "cov x median" -> s * med;
                            case "cov x max" -> s * max;
                            case "perm" -> o.noise().permutationSigma().get(n);
                            case "max(cov x median, perm)" -> Math.max(s * med, o.noise().permutationSigma().get(n));
                            default -> Math.max(s * max, o.noise().permutationSigma().get(n));
                        }));
                    }
                    Map<String, List<Double>> by = CalibrationRuns.byParameter(pulls);
                    List<Double> all = by.values().stream().flatMap(List::stream).toList();
                    StringBuilder sp = new StringBuilder();
                    by.forEach((k, v) -> sp.append(String.format(Locale.ROOT, "%s %.2f; ", k, CalibrationRuns.spread(v))));
                    System.out.printf(Locale.ROOT, "RULE %s %s %-26s 68: %.1f %% 95: %.1f %% %s%n", g,
                            noise.redPpm() > 0 ? "red" : "white", rule, 100 * CalibrationRuns.coverage(all, 1),
                            100 * CalibrationRuns.coverage(all, 1.959964), sp);
                }
            }
        }
    }

    static double ingressMinutes(org.twinlight.eclipse.BinaryParameters p) {
        double c = Math.cos(Math.toRadians(p.inclinationDeg()));
        double s = Math.sin(Math.toRadians(p.inclinationDeg()));
        double a = Math.asin(Math.sqrt(Math.pow(p.radius1() + p.radius2(), 2) - c * c) / s);
        double inner = Math.pow(p.radius1() - p.radius2(), 2) - c * c;
        double b = inner > 0 ? Math.asin(Math.sqrt(inner) / s) : 0;
        return p.periodDays() / Math.PI * (a - b) / 2 * 1440;
    }
}

package org.twinlight.bench;

import java.util.Random;
import org.twinlight.timing.minima.EphemerisModel;
import org.twinlight.timing.minima.OcAnalysis;
import org.twinlight.timing.minima.OcModelChoiceTest;
import org.twinlight.timing.minima.OcResult;

/**
 * The large version of {@code OcModelChoiceTest.constantPeriodRarelyClaimsAChange}: the rate at
 * which a period change (quadratic or light-time) is claimed on constant-period timings with honest
 * errors, over many noise sets, for the model choice and for the plain smallest-BIC rule. Run with
 * {@code java -cp target/classes:target/test-classes:$(deps) org.twinlight.bench.OcModelChoiceBench [SETS]}.
 */
public final class OcModelChoiceBench {

    private OcModelChoiceBench() {
    }

    public static void main(String[] args) {
        int sets = args.length > 0 ? Integer.parseInt(args[0]) : 1000;
        for (int[] shape : new int[][] {{8, 5}, {4, 5}, {12, 8}}) {
            int claims = 0;
            int quadratic = 0;
            int lightTime = 0;
            int oldRule = 0;
            long t0 = System.nanoTime();
            for (long seed = 0; seed < sets; seed++) {
                OcResult r = OcAnalysis.analyse(OcModelChoiceTest.groundTimings(shape[0], shape[1], 0.0005,
                        t -> 0, new Random(seed)), OcModelChoiceTest.REFERENCE, true);
                claims += r.periodChangeFound() ? 1 : 0;
                quadratic += r.preferred() == EphemerisModel.QUADRATIC ? 1 : 0;
                lightTime += r.preferred() == EphemerisModel.LIGHT_TIME ? 1 : 0;
                double best = r.fits().stream().mapToDouble(f -> f.bic()).min().orElseThrow();
                oldRule += best < r.linear().bic() ? 1 : 0;
            }
            System.out.printf("%d seasons x %d timings, %d sets: change claimed %.1f %% (quadratic %d, light-time %d);"
                    + " smallest-BIC rule %.1f %%; %.0f ms a set%n", shape[0], shape[1], sets, 100.0 * claims / sets,
                    quadratic, lightTime, 100.0 * oldRule / sets, (System.nanoTime() - t0) / 1e6 / sets);
        }
    }
}

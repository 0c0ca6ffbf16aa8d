package org.twinlight.velocity;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Random;

/**
 * Makes {@code sample-curves/corvel-pair-rv.csv}: radial velocities of the fictional Corvel Pair
 * from the project's velocity model ({@link VelocityModel#curve}) with the orbit of
 * {@code corvel-pair.model.json} (circular, P = 0.8731542 d, epoch 2460571.41238 HJD_UTC) and
 * K1 = 121.9, K2 = 148.7, γ = −17.4 km/s (masses near 1.00 and 0.82 nominal solar masses at
 * i = 84.6°). Two fictional instruments: {@code echelle-north} (errors 1.2–2.4 km/s) and
 * {@code survey-spectrograph} (errors 2.5–4.5 km/s, zero point +0.9 km/s from the first). Nights
 * only, and no spectrum within 0.07 in phase of a conjunction, where the lines blend.
 *
 * <p>Run: {@code java -cp target/classes:target/test-classes org.twinlight.velocity.CorvelPairVelocities
 * sample-curves/corvel-pair-rv.csv}.
 */
public final class CorvelPairVelocities {
    static final double PERIOD_DAYS = 0.8731542;
    static final double EPOCH = 2460571.41238;
    static final double K1 = 121.9;
    static final double K2 = 148.7;
    static final double GAMMA = -17.4;
    static final double SECOND_INSTRUMENT_OFFSET = 0.9;

    private CorvelPairVelocities() {
    }

    public static void main(String[] args) throws IOException {
        Path out = Path.of(args.length > 0 ? args[0] : "sample-curves/corvel-pair-rv.csv");
        VelocityParameters p = new VelocityParameters(PERIOD_DAYS, EPOCH, 0, 90, K1, K2, GAMMA, new double[0], 0, 0);
        Random rng = new Random(20240917);
        StringBuilder sb = new StringBuilder("# time scale: HJD_UTC\n# synthetic radial velocities of the fictional "
                + "Corvel Pair (sample-curves/README.md), km/s\ntime,v1,v1_err,v2,v2_err,instrument\n");
        int written = 0;
        double night = 2460540.0;
        while (written < 32) {
            night += 1 + rng.nextInt(4);
            double t = night + 0.30 + 0.38 * rng.nextDouble();
            double phase = (t - EPOCH) / PERIOD_DAYS;
            phase -= Math.floor(phase);
            double fromConjunction = Math.min(Math.min(phase, 1 - phase), Math.abs(phase - 0.5));
            if (fromConjunction < 0.07) {
                continue;
            }
            boolean second = rng.nextDouble() < 0.4;
            double e1 = second ? 2.5 + rng.nextDouble() : 1.2 + 0.6 * rng.nextDouble();
            double e2 = second ? 3.5 + rng.nextDouble() : 1.8 + 0.6 * rng.nextDouble();
            double offset = second ? SECOND_INSTRUMENT_OFFSET : 0;
            double v1 = VelocityModel.curve(new double[] {t}, 1, p)[0] + offset + e1 * rng.nextGaussian();
            double v2 = VelocityModel.curve(new double[] {t}, 2, p)[0] + offset + e2 * rng.nextGaussian();
            sb.append(String.format(Locale.ROOT, "%.5f,%.2f,%.1f,%.2f,%.1f,%s%n", t, v1, e1, v2, e2,
                    second ? "survey-spectrograph" : "echelle-north"));
            written++;
        }
        Files.writeString(out, sb.toString());
    }
}

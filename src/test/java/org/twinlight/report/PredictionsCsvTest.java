package org.twinlight.report;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Locale;
import java.util.Random;
import org.junit.jupiter.api.Test;

class PredictionsCsvTest {

    // the fast fixed-point text must equal java.util.Formatter's %.Nf (HALF_UP) away from exact ties
    @Test
    void fixedPointTextMatchesTheFormatter() {
        Random r = new Random(3);
        for (int i = 0; i < 20000; i++) {
            double v = (r.nextDouble() - 0.5) * Math.pow(10, r.nextInt(9) - 2);
            int d = r.nextInt(7);
            double scaled = Math.abs(v) * Math.pow(10, d);
            if (Math.abs(scaled - Math.floor(scaled) - 0.5) < 1e-6) {
                continue; // a tie in binary rounding: either text is right
            }
            assertThat(PredictionsCsv.f(v, d)).as("%s, %d", v, d).isEqualTo(String.format(Locale.ROOT, "%." + d + "f", v));
        }
        assertThat(PredictionsCsv.f(-0.0004, 2)).isEqualTo(String.format(Locale.ROOT, "%.2f", -0.0004));
        assertThat(PredictionsCsv.f(2461465.7251224, 6)).isEqualTo("2461465.725122");
    }
}

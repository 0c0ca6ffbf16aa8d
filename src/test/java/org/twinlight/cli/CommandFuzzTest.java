package org.twinlight.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.twinlight.photometry.DamagedInputs;

/**
 * Every command that reads photometry or velocities, given damaged files: exit 2 with the file named, or a
 * clean result; never an internal error or a stack trace, never a changed input, never a partial
 * result set. The larger run is {@code org.twinlight.bench.FuzzBench}.
 */
class CommandFuzzTest extends CommandTestSupport {
    private static final String MODEL = """
            {"period": 0.17, "epoch": 2460100.30, "radius1": 0.13, "radius2": 0.09, "inclination": 88.0,
             "surfaceBrightnessRatio": 0.6,
             "limbDarkening1": {"law": "quadratic", "coefficients": [0.4, 0.2]},
             "limbDarkening2": {"law": "quadratic", "coefficients": [0.45, 0.2]}}
            """;

    /** A fit.json as the fit command writes it, for the commands that read velocities. */
    private static final String FIT_JSON = """
            {"parameters": {
              "period": {"value": 0.17, "uncertainty": 0.0, "free": false},
              "radius1": {"value": 0.13, "uncertainty": 0.001, "free": true},
              "radius2": {"value": 0.09, "uncertainty": 0.001, "free": true},
              "inclination": {"value": 88.0, "uncertainty": 0.3, "free": true}},
             "model": {"period": 0.17, "epoch": 2460100.30, "radius1": 0.13, "radius2": 0.09, "inclination": 88.0,
               "surfaceBrightnessRatio": 0.6},
             "timeScale": "BJD_TDB"}
            """;

    /** Damaged inputs by name: each is bad for every command. */
    private Map<String, byte[]> badInputs() throws Exception {
        DamagedInputs good = new DamagedInputs(40);
        byte[] fits = good.fits(dir);
        Random random = new Random(5);
        Map<String, byte[]> m = new LinkedHashMap<>();
        m.put("cut.fits", Arrays.copyOf(fits, 2880 + 800));
        m.put("cut-data.fits", Arrays.copyOf(fits, DamagedInputsAccess.dataStart(fits) + 50));
        m.put("random.dat", DamagedInputs.randomBytes(random, 3000));
        m.put("empty.csv", new byte[0]);
        m.put("comma-decimal.csv", good.text(",", ',').getBytes(StandardCharsets.UTF_8));
        m.put("header-only.csv", "time,flux\n".getBytes(StandardCharsets.UTF_8));
        return m;
    }

    private static List<String[]> commands(Path in, Path model, Path out) {
        List<String[]> c = new ArrayList<>();
        c.add(new String[] {"inspect", in.toString()});
        c.add(new String[] {"period", in.toString(), "--out", out.toString()});
        c.add(new String[] {"minima", in.toString(), "--period", "0.17", "--epoch", "2460100.30", "--out",
            out.toString()});
        c.add(new String[] {"fit", in.toString(), "--model", model.toString(), "--out", out.toString()});
        c.add(new String[] {"time", in.toString(), "--from", "JD_UTC", "--to", "JD_TT"});
        c.add(new String[] {"analyse", in.toString(), "--out", out.toString()});
        c.add(new String[] {"simulate", "--model", model.toString(), "--times", in.toString(), "--out",
            out.resolve("sim.csv").toString()});
        Path fit = model.resolveSibling("fit.json");
        c.add(new String[] {"velocities", in.toString(), "--model", fit.toString(), "--out", out.toString()});
        c.add(new String[] {"dimensions", "--fit", fit.toString(), "--velocities", in.toString(), "--out",
            out.toString()});
        // given as the batch's folder-or-manifest argument: a damaged file is a bad manifest (a damaged light
        // curve inside a batch folder fails its own target only: BatchCommandTest)
        c.add(new String[] {"batch", in.toString(), "--out", out.toString()});
        return c;
    }

    @Test
    void badFilesGiveExitTwoNamingTheFileInEveryCommand() throws Exception {
        Path model = Files.writeString(dir.resolve("model.json"), MODEL);
        Files.writeString(dir.resolve("fit.json"), FIT_JSON);
        for (Map.Entry<String, byte[]> e : badInputs().entrySet()) {
            Path in = Files.write(dir.resolve(e.getKey()), e.getValue());
            Path out = dir.resolve("out-" + e.getKey());
            for (String[] args : commands(in, model, out)) {
                err.getBuffer().setLength(0);
                int code = console.run(args);
                String what = String.join(" ", args);
                assertThat(code).as(what + "\n" + err).isEqualTo(2);
                assertThat(err.toString()).as(what).contains(e.getKey()).doesNotContain("internal error")
                        .doesNotContain("Exception").doesNotContain("\tat ").doesNotContain("Cannot invoke");
                assertThat(Files.readAllBytes(in)).as(what).isEqualTo(e.getValue());
                assertThat(Files.exists(out.resolve("period.json")) || Files.exists(out.resolve("fit.json"))
                        || Files.exists(out.resolve("minima.csv")) || Files.exists(out.resolve("velocities.json"))
                        || Files.exists(out.resolve("dimensions.json"))).as(what).isFalse();
            }
        }
    }

    /** Package bridge to the FITS layout helper. */
    private static final class DamagedInputsAccess {
        static int dataStart(byte[] fits) {
            for (int at = fits.length - 2880; at >= 0; at -= 2880) {
                String block = new String(fits, at, 2880, StandardCharsets.US_ASCII);
                if (block.contains("END     ")) {
                    return at + 2880;
                }
            }
            return 0;
        }
    }
}

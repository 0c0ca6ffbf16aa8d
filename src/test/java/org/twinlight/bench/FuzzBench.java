package org.twinlight.bench;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Locale;
import java.util.Random;
import org.twinlight.BadInputException;
import org.twinlight.photometry.DamagedInputs;
import org.twinlight.photometry.LightCurveReader;
import org.twinlight.photometry.ReadOptions;

/**
 * The large run of the reader fuzz test: N damaged files (default 20,000) of each kind, FITS and
 * CSV with 1–8 flipped bytes, FITS cut at every card, block and row, and random bytes. Counts the
 * outcomes; any exception other than a bad-input refusal, or a changed input, is printed and
 * counted as a failure. Run: {@code java -cp $CP org.twinlight.bench.FuzzBench [N] [seed]}.
 */
public final class FuzzBench {
    private FuzzBench() {
    }

    public static void main(String[] args) throws Exception {
        int n = args.length > 0 ? Integer.parseInt(args[0]) : 20_000;
        long seed = args.length > 1 ? Long.parseLong(args[1]) : 1;
        Path dir = Files.createTempDirectory("twinlight-fuzz");
        DamagedInputs good = new DamagedInputs(200);
        byte[] fits = good.fits(dir);
        byte[] csv = good.text(",", '.').getBytes(StandardCharsets.UTF_8);
        Random random = new Random(seed);
        int[] counts = new int[3]; // read, refused, failures
        long t0 = System.nanoTime();
        for (int cut : DamagedInputs.fitsCuts(fits, 24)) {
            check(dir, "cut.fits", Arrays.copyOf(fits, cut), counts);
        }
        for (int k = 0; k < n; k++) {
            check(dir, "flip.fits", DamagedInputs.flipped(fits, random, 1 + random.nextInt(8)), counts);
            check(dir, "flip.csv", DamagedInputs.flipped(csv, random, 1 + random.nextInt(8)), counts);
            if (k % 10 == 0) {
                check(dir, "random.dat", DamagedInputs.randomBytes(random, random.nextInt(20_000)), counts);
            }
        }
        double s = (System.nanoTime() - t0) / 1e9;
        System.out.printf(Locale.ROOT, "%d files in %.1f s: %d read, %d refused as bad input, %d failures%n",
                counts[0] + counts[1] + counts[2], s, counts[0], counts[1], counts[2]);
    }

    private static void check(Path dir, String name, byte[] bytes, int[] counts) throws Exception {
        Path p = Files.write(dir.resolve(name), bytes);
        try {
            LightCurveReader.read(p, ReadOptions.defaults());
            counts[0]++;
        } catch (BadInputException e) {
            if (e.getMessage().contains("Exception") || e.getMessage().contains("Cannot invoke")) {
                System.out.println("library text in message: " + e.getMessage());
                counts[2]++;
            } else {
                counts[1]++;
            }
        } catch (RuntimeException | StackOverflowError e) {
            System.out.println(name + ": " + e);
            Files.write(dir.resolve("failure-" + counts[2] + "-" + name), bytes);
            counts[2]++;
        }
        if (!Arrays.equals(Files.readAllBytes(p), bytes)) {
            System.out.println(name + ": input changed");
            counts[2]++;
        }
    }
}

package org.twinlight.report;

import java.io.IOException;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import nom.tam.fits.BinaryTable;
import nom.tam.fits.BinaryTableHDU;
import nom.tam.fits.Fits;
import nom.tam.fits.FitsException;
import nom.tam.fits.Header;
import nom.tam.util.FitsOutputStream;
import org.twinlight.photometry.LightCurve;
import org.twinlight.time.TimeReference;
import org.twinlight.time.TimeScale;

/** Writes light curves as CSV (flux or magnitudes) or as a FITS binary table, atomically. */
public final class LightCurveFiles {
    /** 2.5/ln 10: σ_m = 1.0857 σ_F/F (first-order error propagation of m = −2.5 log₁₀ F). */
    private static final double MAG_PER_LN = 2.5 / Math.log(10);

    private LightCurveFiles() {
    }

    /**
     * CSV {@code time,flux[,flux_err]} (or {@code time,mag[,mag_err]} when
     * {@code referenceMagnitude} is not null: m = m₀ − 2.5 log₁₀ F), preceded by {@code #} lines
     * with the time scale and any notes.
     */
    public static void writeCsv(LightCurve lc, Path target, Double referenceMagnitude, String... notes) {
        AtomicFiles.write(target, out -> {
            Writer w = new OutputStreamWriter(out, StandardCharsets.UTF_8);
            w.write("# time scale: " + lc.timeScale().label() + "\n");
            for (String n : notes) {
                w.write("# " + n + "\n");
            }
            boolean mag = referenceMagnitude != null;
            w.write(mag ? "time,mag" : "time,flux");
            w.write(lc.hasErrors() ? (mag ? ",mag_err\n" : ",flux_err\n") : "\n");
            for (int i = 0; i < lc.size(); i++) {
                double f = lc.flux(i);
                w.write(Double.toString(lc.time(i)));
                w.write(',');
                if (mag) {
                    w.write(String.format(java.util.Locale.ROOT, "%.6f", referenceMagnitude - MAG_PER_LN * Math.log(f)));
                } else {
                    w.write(String.format(java.util.Locale.ROOT, "%.8f", f));
                }
                if (lc.hasErrors()) {
                    w.write(',');
                    double e = mag ? MAG_PER_LN * lc.fluxError(i) / f : lc.fluxError(i);
                    w.write(String.format(java.util.Locale.ROOT, "%.3e", e));
                }
                w.write('\n');
            }
            w.flush();
        });
    }

    /**
     * A FITS file with an empty primary HDU and one binary table (TIME, FLUX[, FLUX_ERR], QUALITY)
     * whose times are days since {@code referenceJd}, described by the FITS time keywords (Rots et
     * al. 2015, A&amp;A 574, A36): TIMESYS, TREFPOS (and the older TIMEREF), TIMEUNIT and the split
     * reference JDREFI/JDREFF. FLUX_ERR is left out when the light curve has no errors.
     */
    public static void writeFits(LightCurve lc, Path target, double referenceJd, String objectName) {
        AtomicFiles.write(target, out -> {
            try {
                int n = lc.size();
                double[] time = new double[n];
                float[] flux = new float[n];
                float[] err = new float[n];
                int[] quality = new int[n];
                for (int i = 0; i < n; i++) {
                    time[i] = lc.time(i) - referenceJd;
                    flux[i] = (float) lc.flux(i);
                    err[i] = (float) lc.fluxError(i);
                }
                BinaryTable table = new BinaryTable();
                table.addColumn(time);
                table.addColumn(flux);
                // a noise-free curve has no errors: no FLUX_ERR column rather than one of NaN, which no
                // reader (this one included) could use
                if (lc.hasErrors()) {
                    table.addColumn(err);
                }
                table.addColumn(quality);
                BinaryTableHDU hdu = (BinaryTableHDU) Fits.makeHDU(table);
                int col = 0;
                hdu.setColumnName(col++, "TIME", "time of mid-exposure");
                hdu.setColumnName(col++, "FLUX", "relative flux");
                if (lc.hasErrors()) {
                    hdu.setColumnName(col++, "FLUX_ERR", "1-sigma error of FLUX");
                }
                hdu.setColumnName(col, "QUALITY", "0 = good");
                Header h = hdu.getHeader();
                h.addValue("EXTNAME", "LIGHTCURVE", "photometry table");
                h.addValue("OBJECT", objectName, "target name");
                TimeScale scale = lc.timeScale();
                if (scale.isKnown()) {
                    h.addValue("TIMESYS", scale.standard().name(), "time standard of TIME");
                    h.addValue("TREFPOS", refPos(scale.reference()), "reference position of TIME");
                    h.addValue("TIMEREF", timeRef(scale.reference()), "older name of TREFPOS");
                }
                double whole = Math.floor(referenceJd);
                h.addValue("JDREFI", (long) whole, "integer part of the reference JD");
                h.addValue("JDREFF", referenceJd - whole, "fractional part of the reference JD");
                h.addValue("TIMEUNIT", "d", "unit of TIME");
                h.addValue("TUNIT1", "d", "");
                h.addValue("CREATOR", "twinlight simulate", "");
                Fits f = new Fits();
                nom.tam.fits.BasicHDU<?> primary = Fits.makeHDU((Object) null);
                // a fixed comment instead of the library's time stamp: the same input gives the same file
                primary.getHeader().addValue("SIMPLE", true, "conforms to the FITS standard");
                f.addHDU(primary);
                f.addHDU(hdu);
                FitsOutputStream fo = new FitsOutputStream(out);
                f.write(fo);
                fo.flush();
            } catch (FitsException e) {
                throw new IOException("cannot write FITS table: " + e.getMessage(), e);
            }
        });
    }

    /** The FITS time standard's TREFPOS value of a reference position (Rots et al. 2015, sect. 4.2). */
    private static String refPos(TimeReference r) {
        return switch (r) {
            case GEOCENTRIC -> "GEOCENTER";
            case HELIOCENTRIC -> "HELIOCENTER";
            case BARYCENTRIC -> "BARYCENTER";
        };
    }

    private static String timeRef(TimeReference r) {
        return switch (r) {
            case GEOCENTRIC -> "GEOCENTER";
            case HELIOCENTRIC -> "HELIOCENTER";
            case BARYCENTRIC -> "SOLARSYSTEM";
        };
    }
}

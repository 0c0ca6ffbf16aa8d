package org.twinlight.report;

import java.awt.Color;
import java.awt.Graphics2D;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.fit.FitResult;
import org.twinlight.fit.FittedCurve;

/**
 * The picture of a fit: the phase-folded light curve with the model, the residuals below it, and
 * close-ups of both eclipses, in one PNG.
 */
public final class FitPlot {
    private static final int WIDTH = 1200;
    private static final double PHASE_START = -0.25;
    /** Points left out as outliers: the blue of the Okabe &amp; Ito (2008) colour-blind-safe palette. */
    private static final Color OUTLIER = new Color(0x00, 0x72, 0xB2);

    /**
     * At most this many data points are drawn: a plot of millions of points looks the same thinned to
     * every k-th point and takes a fraction of the time (the fit itself uses them all).
     */
    static final int MAX_PLOTTED_POINTS = 100_000;

    private FitPlot() {
    }

    /** Writes the plot of band {@code band} of a fit to {@code target}. */
    public static void write(FitResult r, String band, Path target, String title, String timeScale) {
        BinaryParameters p = r.model().forBand(band);
        BinaryModel model = new BinaryModel(p);
        List<double[]> pts = new ArrayList<>();
        List<double[]> out = new ArrayList<>();
        for (FittedCurve c : r.curves()) {
            if (!c.band().equals(band)) {
                continue;
            }
            for (int i = 0; i < c.size(); i++) {
                (c.clipped()[i] ? out : pts).add(new double[] {phase(c.timesDays()[i], p), c.flux()[i], c.residual(i)});
            }
        }
        String dataLabel = "data";
        if (pts.size() > MAX_PLOTTED_POINTS) {
            int stride = (pts.size() + MAX_PLOTTED_POINTS - 1) / MAX_PLOTTED_POINTS;
            List<double[]> thinned = new ArrayList<>();
            for (int i = 0; i < pts.size(); i += stride) {
                thinned.add(pts.get(i));
            }
            dataLabel = String.format(java.util.Locale.ROOT, "data (every %d%s point of %,d)", stride,
                    stride == 2 ? "nd" : stride == 3 ? "rd" : "th", pts.size());
            pts = thinned;
        }
        double[] ph = column(pts, 0, 1);
        double[] fl = column(pts, 1, 1);
        double[] res = column(pts, 2, 1e3);

        int grid = 4000;
        double[] mph = new double[grid];
        double[] mfl = new double[grid];
        for (int i = 0; i < grid; i++) {
            mph[i] = PHASE_START + i / (double) (grid - 1);
            mfl[i] = model.flux(p.epochDays() + mph[i] * p.periodDays());
        }
        double secondary = p.orbit().secondaryPhase();
        double[] primaryWindow = window(model, p, 0.0);
        double[] secondaryWindow = window(model, p, secondary > 0.75 ? secondary - 1 : secondary);

        XYChart full = chart(WIDTH, 430, String.format(java.util.Locale.ROOT, "%s%s: P = %.7f d, T0 = %.6f (%s)",
                title, r.curves().stream().map(FittedCurve::band).distinct().count() < 2 ? "" : ", band " + band, p.periodDays(), p.epochDays(), timeScale),
                "orbital phase", "normalised flux");
        full.getStyler().setLegendPosition(org.knowm.xchart.style.Styler.LegendPosition.InsideS);
        full.getStyler().setLegendLayout(org.knowm.xchart.style.Styler.LegendLayout.Horizontal);
        addData(full, dataLabel, ph, fl);
        addClipped(full, out, 1, 1);
        addModel(full, "model", mph, mfl);
        full.getStyler().setXAxisMin(PHASE_START).setXAxisMax(PHASE_START + 1);

        String verdict = r.adequacy().describesData() ? null
                : "data − model: the model does not describe the data (see the notes in fit.json)";
        XYChart resid = chart(WIDTH, 220, verdict, "orbital phase", "data − model (ppt)");
        addData(resid, "residuals", ph, res);
        addClipped(resid, out, 2, 1e3);
        addModel(resid, "zero", new double[] {PHASE_START, PHASE_START + 1}, new double[] {0, 0});
        resid.getStyler().setXAxisMin(PHASE_START).setXAxisMax(PHASE_START + 1).setLegendVisible(false);

        XYChart zoom1 = zoom("primary eclipse", ph, fl, mph, mfl, primaryWindow);
        XYChart zoom2 = zoom(String.format(java.util.Locale.ROOT, "secondary eclipse (phase %.4f)", secondary), ph,
                fl, mph, mfl, secondaryWindow);

        BufferedImage img = new BufferedImage(WIDTH, 430 + 220 + 400, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = img.createGraphics();
        g.setColor(Color.WHITE);
        g.fillRect(0, 0, img.getWidth(), img.getHeight());
        g.drawImage(BitmapEncoder.getBufferedImage(full), 0, 0, null);
        g.drawImage(BitmapEncoder.getBufferedImage(resid), 0, 430, null);
        g.drawImage(BitmapEncoder.getBufferedImage(zoom1), 0, 650, null);
        g.drawImage(BitmapEncoder.getBufferedImage(zoom2), WIDTH / 2, 650, null);
        g.dispose();
        PlotFiles.writeImage(img, target);
    }

    private static XYChart zoom(String title, double[] ph, double[] fl, double[] mph, double[] mfl, double[] w) {
        List<double[]> sel = new ArrayList<>();
        for (int i = 0; i < ph.length; i++) {
            if (ph[i] >= w[0] && ph[i] <= w[1]) {
                sel.add(new double[] {ph[i], fl[i]});
            }
        }
        List<double[]> msel = new ArrayList<>();
        for (int i = 0; i < mph.length; i++) {
            if (mph[i] >= w[0] && mph[i] <= w[1]) {
                msel.add(new double[] {mph[i], mfl[i]});
            }
        }
        XYChart c = chart(WIDTH / 2, 400, title, "orbital phase", "normalised flux");
        if (!sel.isEmpty()) {
            addData(c, "data", sel.stream().mapToDouble(a -> a[0]).toArray(), sel.stream().mapToDouble(a -> a[1]).toArray());
        }
        addModel(c, "model", msel.stream().mapToDouble(a -> a[0]).toArray(), msel.stream().mapToDouble(a -> a[1]).toArray());
        c.getStyler().setXAxisMin(w[0]).setXAxisMax(w[1]).setLegendVisible(false);
        return c;
    }

    /** Phase window around an eclipse centre: 1.6 × the eclipse's width from the model, at least ±0.01. */
    private static double[] window(BinaryModel model, BinaryParameters p, double centre) {
        double step = 1e-4;
        double half = 0;
        for (double d = step; d < 0.25; d += step) {
            boolean inside = model.flux(p.epochDays() + (centre + d) * p.periodDays()) < 1 - 1e-7
                    || model.flux(p.epochDays() + (centre - d) * p.periodDays()) < 1 - 1e-7;
            if (!inside) {
                break;
            }
            half = d;
        }
        half = Math.max(0.01, 1.6 * half);
        return new double[] {centre - half, centre + half};
    }

    private static double phase(double t, BinaryParameters p) {
        double ph = (t - p.epochDays()) / p.periodDays();
        ph -= Math.floor(ph);
        return ph >= PHASE_START + 1 ? ph - 1 : ph;
    }

    private static XYChart chart(int w, int h, String title, String x, String y) {
        XYChart c = new XYChartBuilder().width(w).height(h).title(title == null ? "" : title).xAxisTitle(x)
                .yAxisTitle(y).build();
        PlotFiles.style(c);
        c.getStyler().setChartTitleVisible(title != null);
        c.getStyler().setMarkerSize(3);
        c.getStyler().setXAxisDecimalPattern("0.00##");
        return c;
    }

    private static void addData(XYChart c, String name, double[] x, double[] y) {
        XYSeries s = c.addSeries(name, x, y);
        s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
        s.setMarker(SeriesMarkers.CIRCLE);
        s.setMarkerColor(PlotFiles.DATA);
    }

    private static double[] column(List<double[]> rows, int k, double factor) {
        return rows.stream().mapToDouble(a -> a[k] * factor).toArray();
    }

    /** Points left out as outliers: another colour and marker, so they read apart without colour too. */
    private static void addClipped(XYChart c, List<double[]> rows, int k, double factor) {
        if (rows.isEmpty()) {
            return;
        }
        XYSeries s = c.addSeries("left out (outliers)", column(rows, 0, 1), column(rows, k, factor));
        s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
        s.setMarker(SeriesMarkers.DIAMOND);
        s.setMarkerColor(OUTLIER);
    }

    private static void addModel(XYChart c, String name, double[] x, double[] y) {
        XYSeries s = c.addSeries(name, x, y);
        s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
        s.setMarker(SeriesMarkers.NONE);
        s.setLineColor(PlotFiles.MODEL);
        s.setLineWidth(1.6f);
    }
}

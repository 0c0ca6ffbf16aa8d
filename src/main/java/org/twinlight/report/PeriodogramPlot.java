package org.twinlight.report;

import java.awt.Color;
import java.awt.Graphics2D;
import java.awt.image.BufferedImage;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import javax.imageio.ImageIO;
import org.knowm.xchart.AnnotationText;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.twinlight.photometry.LightCurve;
import org.twinlight.timing.period.PeriodCandidate;
import org.twinlight.timing.period.PeriodSearchResult;
import org.twinlight.timing.period.Periodogram;

/**
 * The period-search figure: the BLS periodogram (signal residue against period, logarithmic period
 * axis) with the chosen period and the runners-up marked, above the light curve folded at the chosen
 * period (primary eclipse at phase 0, shown from −0.25 to 0.75 so that a secondary near 0.5 is whole).
 */
public final class PeriodogramPlot {
    static final int WIDTH = 1100;
    static final int TOP_HEIGHT = 420;
    static final int BOTTOM_HEIGHT = 420;
    /** Periodogram points drawn at most (the maximum in each of this many log-period cells is kept). */
    static final int MAX_PERIODOGRAM_POINTS = 3000;
    /** Data points drawn at most in the folded panel (evenly thinned). */
    static final int MAX_FOLDED_POINTS = 15000;
    /** Phase bins of the mean folded curve. */
    static final int FOLDED_BINS = 250;

    private PeriodogramPlot() {
    }

    /** Draws the figure for {@code result} of the search on {@code lc} and writes it to {@code target} (PNG). */
    public static void write(Path target, PeriodSearchResult result, LightCurve lc) {
        BufferedImage top = BitmapEncoder.getBufferedImage(periodogramChart(result, lc.source()));
        BufferedImage bottom = BitmapEncoder.getBufferedImage(foldedChart(result, lc));
        BufferedImage all = new BufferedImage(WIDTH, TOP_HEIGHT + BOTTOM_HEIGHT, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = all.createGraphics();
        g.setColor(Color.WHITE);
        g.fillRect(0, 0, all.getWidth(), all.getHeight());
        g.drawImage(top, 0, 0, null);
        g.drawImage(bottom, 0, TOP_HEIGHT, null);
        g.dispose();
        try {
            ByteArrayOutputStream buf = new ByteArrayOutputStream();
            ImageIO.write(all, "png", buf);
            AtomicFiles.writeBytes(target, buf.toByteArray());
        } catch (IOException e) {
            throw new UncheckedIOException("cannot render " + target + ": " + e.getMessage(), e);
        }
    }

    static XYChart periodogramChart(PeriodSearchResult result, String source) {
        Periodogram pg = result.periodogram();
        XYChart chart = new XYChartBuilder().width(WIDTH).height(TOP_HEIGHT)
                .title(String.format(Locale.ROOT, "BLS periodogram of %s: %s, P = %s d%s; highest peak SDE %.1f",
                        source, result.decision().status().label().toUpperCase(Locale.ROOT),
                        withError(result.periodDays(), result.periodUncertaintyDays()),
                        alternatives(result.decision()), result.sde()))
                .xAxisTitle("period (days, logarithmic)").yAxisTitle("signal residue SR").build();
        PlotFiles.style(chart);
        chart.getStyler().setXAxisLogarithmic(true);
        chart.getStyler().setXAxisLogarithmicDecadeOnly(false); // label 2, 3, 5 ... between the decades too
        chart.getStyler().setMarkerSize(9);
        chart.getStyler().setLegendPosition(org.knowm.xchart.style.Styler.LegendPosition.InsideNW);
        chart.getStyler().setXAxisDecimalPattern("0.###");
        chart.getStyler().setAnnotationTextFont(new java.awt.Font(java.awt.Font.SANS_SERIF, java.awt.Font.PLAIN, 11));
        chart.getStyler().setAnnotationTextFontColor(Color.DARK_GRAY);
        double[][] thin = thinPeriodogram(pg);
        XYSeries line = chart.addSeries("BLS power", thin[0], thin[1]);
        line.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
        line.setMarker(SeriesMarkers.NONE);
        line.setLineColor(PlotFiles.DATA.darker());
        line.setLineWidth(1f);
        double maxPower = Arrays.stream(thin[1]).max().orElse(1);
        chart.getStyler().setYAxisDecimalPattern(maxPower < 0.01 ? "0.0E0" : "0.000");
        double minPeriod = thin[0][thin[0].length - 1];
        double maxPeriod = thin[0][0];
        List<Double> rx = new ArrayList<>();
        List<Double> ry = new ArrayList<>();
        List<Double> mx = new ArrayList<>();
        List<Double> my = new ArrayList<>();
        double p = result.periodDays();
        for (PeriodCandidate c : result.candidates()) {
            if (!Double.isFinite(c.blsPower()) || Math.abs(c.periodDays() - p) <= 1e-6 * p) {
                continue;
            }
            (c.consistent() ? rx : mx).add(c.periodDays());
            (c.consistent() ? ry : my).add(c.blsPower());
            chart.addAnnotation(new AnnotationText(String.format(Locale.ROOT, "%.4f", c.periodDays()), c.periodDays(),
                    c.blsPower() + 0.045 * maxPower, false));
        }
        if (!rx.isEmpty()) {
            XYSeries r = chart.addSeries("coherent candidates", rx, ry);
            r.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
            r.setMarker(SeriesMarkers.DIAMOND);
            r.setMarkerColor(PlotFiles.SECOND);
        }
        if (!mx.isEmpty()) {
            XYSeries r = chart.addSeries("excluded candidates", mx, my);
            r.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
            r.setMarker(SeriesMarkers.TRIANGLE_UP);
            r.setMarkerColor(PlotFiles.THIRD);
        }
        if (p >= minPeriod && p <= maxPeriod) {
            XYSeries v = chart.addSeries(String.format(Locale.ROOT, "reported P = %.6f d", p), new double[] {p, p},
                    new double[] {0, maxPower * 1.05});
            v.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
            v.setMarker(SeriesMarkers.NONE);
            v.setLineColor(PlotFiles.MODEL);
            v.setLineWidth(1.5f);
        }
        double half = result.periodogram().periodDays(peakIndex(result.periodogram()));
        if (Math.abs(half - p) / p > 1e-3 && half >= minPeriod && half <= maxPeriod) {
            XYSeries h = chart.addSeries(String.format(Locale.ROOT, "highest peak %.6f d", half),
                    new double[] {half, half}, new double[] {0, maxPower * 1.05});
            h.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
            h.setMarker(SeriesMarkers.NONE);
            h.setLineColor(PlotFiles.THIRD);
            h.setLineWidth(1.5f);
            h.setLineStyle(new java.awt.BasicStroke(1.5f, java.awt.BasicStroke.CAP_BUTT,
                    java.awt.BasicStroke.JOIN_MITER, 10f, new float[] {6f, 4f}, 0f));
        }
        PeriodCandidate best = result.candidates().stream()
                .filter(c -> Math.abs(c.periodDays() - p) <= 1e-6 * p).findFirst().orElse(null);
        if (best != null && Double.isFinite(best.blsPower())) {
            XYSeries b = chart.addSeries("reported period", new double[] {best.periodDays()},
                    new double[] {best.blsPower()});
            b.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
            b.setMarker(SeriesMarkers.CIRCLE);
            b.setMarkerColor(PlotFiles.MODEL);
            b.setShowInLegend(false);
        }
        chart.getStyler().setYAxisMin(0.0);
        chart.getStyler().setYAxisMax(maxPower * 1.1);
        return chart;
    }

    /** Keeps the largest power in each of at most {@link #MAX_PERIODOGRAM_POINTS} equal cells of log period. */
    static double[][] thinPeriodogram(Periodogram pg) {
        int n = pg.size();
        if (n <= MAX_PERIODOGRAM_POINTS) {
            return new double[][] {pg.periodsDays(), pg.powers()};
        }
        double lo = Math.log(pg.periodDays(n - 1));
        double hi = Math.log(pg.periodDays(0));
        int cells = MAX_PERIODOGRAM_POINTS;
        double[] px = new double[cells];
        double[] py = new double[cells];
        int m = 0;
        int cell = -1;
        for (int i = 0; i < n; i++) {
            int c = (int) Math.min(cells - 1, (hi - Math.log(pg.periodDays(i))) / (hi - lo) * cells);
            if (c != cell) {
                cell = c;
                px[m] = pg.periodDays(i);
                py[m] = pg.power(i);
                m++;
            } else if (pg.power(i) > py[m - 1]) {
                px[m - 1] = pg.periodDays(i);
                py[m - 1] = pg.power(i);
            }
        }
        return new double[][] {Arrays.copyOf(px, m), Arrays.copyOf(py, m)};
    }

    /** " (or a, b d)" for an ambiguity, else "". */
    private static String alternatives(org.twinlight.timing.period.PeriodDecision d) {
        if (d.alternativesDays().isEmpty()) {
            return "";
        }
        StringBuilder b = new StringBuilder(" (or ");
        for (int i = 0; i < d.alternativesDays().size() && i < 3; i++) {
            b.append(i == 0 ? "" : ", ").append(String.format(Locale.ROOT, "%.6g", d.alternativesDays().get(i)));
        }
        return b.append(d.alternativesDays().size() > 3 ? ", ...)" : ")").toString();
    }

    private static int peakIndex(Periodogram pg) {
        int best = 0;
        for (int i = 1; i < pg.size(); i++) {
            if (pg.power(i) > pg.power(best)) {
                best = i;
            }
        }
        return best;
    }

    static XYChart foldedChart(PeriodSearchResult result, LightCurve lc) {
        double p = result.periodDays();
        double t0 = result.epochDays();
        String secondary = result.secondary().map(sec -> String.format(Locale.ROOT,
                "secondary at phase %.4f, duration ratio %.2f", sec.phase(),
                sec.duration() / result.primary().duration())).orElse("no secondary seen");
        String scale = lc.timeScale().isKnown() ? lc.timeScale().label() : "time scale unknown";
        XYChart chart = new XYChartBuilder().width(WIDTH).height(BOTTOM_HEIGHT)
                .title(String.format(Locale.ROOT, "Folded at P = %.7f d, T0 = %.5f (%s); %s", p, t0, scale,
                        secondary))
                .xAxisTitle("phase").yAxisTitle("relative flux").build();
        PlotFiles.style(chart);
        chart.getStyler().setMarkerSize(2);
        chart.getStyler().setLegendPosition(org.knowm.xchart.style.Styler.LegendPosition.InsideSE);
        int n = lc.size();
        double median = org.twinlight.photometry.RobustStatistics.median(lc.fluxes());
        int stride = Math.max(1, (int) Math.ceil((double) n / MAX_FOLDED_POINTS));
        int m = (n + stride - 1) / stride;
        double[] x = new double[m];
        double[] y = new double[m];
        double[] sum = new double[FOLDED_BINS];
        int[] count = new int[FOLDED_BINS];
        int k = 0;
        for (int i = 0; i < n; i++) {
            double ph = (lc.time(i) - t0) / p + 0.25;
            ph = ph - Math.floor(ph) - 0.25;
            double f = lc.flux(i) / median;
            int b = Math.min(FOLDED_BINS - 1, (int) ((ph + 0.25) * FOLDED_BINS));
            sum[b] += f;
            count[b]++;
            if (i % stride == 0 && k < m) {
                x[k] = ph;
                y[k] = f;
                k++;
            }
        }
        XYSeries pts = chart.addSeries(stride == 1 ? "data" : "data (1 point in " + stride + " shown)",
                Arrays.copyOf(x, k), Arrays.copyOf(y, k));
        pts.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
        pts.setMarker(SeriesMarkers.CIRCLE);
        pts.setMarkerColor(PlotFiles.DATA);
        List<Double> bx = new ArrayList<>();
        List<Double> by = new ArrayList<>();
        for (int b = 0; b < FOLDED_BINS; b++) {
            if (count[b] > 0) {
                bx.add((b + 0.5) / FOLDED_BINS - 0.25);
                by.add(sum[b] / count[b]);
            } else if (!by.isEmpty() && by.get(by.size() - 1) != null) {
                // A phase with no data breaks the line (XChart leaves a gap at a null value): the mean is
                // unknown there, not the straight line between its neighbours.
                bx.add((b + 0.5) / FOLDED_BINS - 0.25);
                by.add(null);
            }
        }
        XYSeries mean = chart.addSeries("mean in " + FOLDED_BINS + " phase bins", bx, by);
        mean.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
        mean.setMarker(SeriesMarkers.NONE);
        mean.setLineColor(PlotFiles.MODEL);
        mean.setLineWidth(1.8f);
        chart.getStyler().setXAxisMin(-0.25);
        chart.getStyler().setXAxisMax(0.75);
        chart.getStyler().setXAxisDecimalPattern("0.00");
        chart.getStyler().setYAxisDecimalPattern("0.000");
        return chart;
    }

    /** "value ± error" with two significant digits in the error and the value to the same decimal. */
    static String withError(double value, double error) {
        if (!(error > 0) || !Double.isFinite(error)) {
            return String.format(Locale.ROOT, "%.6f", value);
        }
        int decimals = Math.max(0, Math.min(12, 1 - (int) Math.floor(Math.log10(error))));
        return String.format(Locale.ROOT, "%." + decimals + "f ± %." + decimals + "f", value, error);
    }

}

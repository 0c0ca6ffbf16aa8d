package org.twinlight.report;

import java.awt.Color;
import java.awt.Graphics2D;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.twinlight.fit.Posterior;
import org.twinlight.sampling.Marginal;

/**
 * Pictures of a sampled posterior: {@code trace.png} (each free parameter against step, every
 * walker a faint line, burn-in marked) and {@code corner.png} (each pair of free parameters with
 * the regions holding 68 % and 95 % of the samples, and each parameter's histogram with its median
 * and 68 % interval). No true values are drawn: these are pictures of results.
 */
public final class PosteriorPlots {
    private static final Color WALKER = new Color(0x44, 0x55, 0x66, 40);
    private static final Color SAMPLE = new Color(0x44, 0x55, 0x66, 25);
    private static final int TRACE_WIDTH = 1100;
    private static final int TRACE_PANEL = 170;
    /** Steps drawn per walker at most (every k-th step beyond). */
    private static final int TRACE_POINTS = 800;
    private static final int CORNER_PANEL = 210;
    private static final int GRID = 36;
    private static final int SCATTER_POINTS = 3000;

    private PosteriorPlots() {
    }

    /**
     * How a column is drawn: values far from zero compared with their spread (an epoch) are drawn
     * as offsets from a whole number named in the axis title, with enough decimals to tell the
     * ticks apart.
     */
    private record Axis(double shift, String title, String pattern) {
        static Axis of(Posterior p, int c) {
            Marginal m = p.marginals().get(c);
            double spread = m.upper95() - m.lower95();
            String name = p.names().get(c);
            if (!(spread > 0)) {
                return new Axis(0, name, "0.####");
            }
            int decimals = Math.max(1, (int) Math.ceil(-Math.log10(spread)) + 2);
            String pattern = "0." + "#".repeat(Math.min(decimals, 12));
            if (Math.abs(m.median()) > 1000 * spread && Math.abs(m.median()) >= 10) {
                double shift = Math.floor(m.median());
                return new Axis(shift, String.format(java.util.Locale.ROOT, "%s − %.0f", name, shift), pattern);
            }
            return new Axis(0, name, pattern);
        }
    }

    /** Writes the trace plot of the free parameters. */
    public static void writeTrace(Path target, Posterior p, String title) {
        int k = p.parameterCount();
        int stride = Math.max(1, (p.steps() + TRACE_POINTS - 1) / TRACE_POINTS);
        XYChart[] charts = new XYChart[k];
        for (int c = 0; c < k; c++) {
            String chartTitle = c == 0 ? title + String.format(java.util.Locale.ROOT, ": %d walkers, %d steps, "
                    + "burn-in %d (dashed)", p.walkers(), p.steps(), p.burnIn()) : null;
            Axis axis = Axis.of(p, c);
            XYChart ch = new XYChartBuilder().width(TRACE_WIDTH).height(TRACE_PANEL + (c == 0 ? 30 : 0))
                    .title(chartTitle == null ? "" : chartTitle).xAxisTitle(c == k - 1 ? "step" : "")
                    .yAxisTitle(axis.title()).build();
            PlotFiles.style(ch);
            ch.getStyler().setChartTitleVisible(chartTitle != null);
            ch.getStyler().setLegendVisible(false);
            ch.getStyler().setYAxisDecimalPattern(axis.pattern());
            int n = (p.steps() + stride - 1) / stride;
            double[] x = new double[n];
            for (int i = 0; i < n; i++) {
                x[i] = i * stride;
            }
            double lo = Double.POSITIVE_INFINITY;
            double hi = Double.NEGATIVE_INFINITY;
            for (int w = 0; w < p.walkers(); w++) {
                double[] y = new double[n];
                for (int i = 0; i < n; i++) {
                    y[i] = p.value(i * stride, w, c) - axis.shift();
                    lo = Math.min(lo, y[i]);
                    hi = Math.max(hi, y[i]);
                }
                XYSeries s = ch.addSeries("walker " + w, x, y);
                s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
                s.setMarker(SeriesMarkers.NONE);
                s.setLineColor(WALKER);
                s.setLineWidth(0.8f);
            }
            XYSeries burn = ch.addSeries("burn-in", new double[] {p.burnIn(), p.burnIn()}, new double[] {lo, hi});
            burn.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
            burn.setMarker(SeriesMarkers.NONE);
            burn.setLineColor(PlotFiles.MODEL);
            burn.setLineStyle(new java.awt.BasicStroke(1.2f, java.awt.BasicStroke.CAP_BUTT,
                    java.awt.BasicStroke.JOIN_MITER, 10f, new float[] {6f, 4f}, 0f));
            charts[c] = ch;
        }
        PlotFiles.writeStackedPng(target, TRACE_WIDTH, charts);
    }

    /** Writes the corner plot of the free parameters. */
    public static void writeCorner(Path target, Posterior p, String title) {
        int k = p.parameterCount();
        double[][] data = new double[k][];
        double[][] range = new double[k][];
        Axis[] axes = new Axis[k];
        for (int c = 0; c < k; c++) {
            axes[c] = Axis.of(p, c);
            data[c] = p.retained(c);
            for (int i = 0; i < data[c].length; i++) {
                data[c][i] -= axes[c].shift();
            }
            double[] s = data[c].clone();
            Arrays.sort(s);
            double lo = Marginal.quantile(s, 0.001);
            double hi = Marginal.quantile(s, 0.999);
            double pad = hi > lo ? 0.05 * (hi - lo) : Math.max(1e-12, Math.abs(lo) * 1e-9);
            range[c] = new double[] {lo - pad, hi + pad};
        }
        int head = 40;
        BufferedImage img = new BufferedImage(k * CORNER_PANEL, k * CORNER_PANEL + head, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = img.createGraphics();
        g.setColor(Color.WHITE);
        g.fillRect(0, 0, img.getWidth(), img.getHeight());
        g.setColor(Color.DARK_GRAY);
        g.setFont(new java.awt.Font(java.awt.Font.SANS_SERIF, java.awt.Font.BOLD, 14));
        g.drawString(title + ": 68% and 95% regions of the posterior (" + data[0].length + " samples after burn-in)",
                10, 25);
        for (int row = 0; row < k; row++) {
            for (int col = 0; col <= row; col++) {
                XYChart ch = row == col ? histogram(p, data[col], range[col], col, axes[col], row == k - 1)
                        : pair(data[col], data[row], range[col], range[row], axes[col], axes[row], row == k - 1,
                                col == 0);
                g.drawImage(BitmapEncoder.getBufferedImage(ch), col * CORNER_PANEL, head + row * CORNER_PANEL, null);
            }
        }
        g.dispose();
        PlotFiles.writeImage(img, target);
    }

    private static XYChart panel(Axis x, Axis y, boolean bottom, boolean left) {
        XYChart ch = panel(bottom ? x.title() : "", left && y != null ? y.title() : "");
        ch.getStyler().setXAxisDecimalPattern(x.pattern());
        if (y != null) {
            ch.getStyler().setYAxisDecimalPattern(y.pattern());
        }
        return ch;
    }

    private static XYChart panel(String xTitle, String yTitle) {
        XYChart ch = new XYChartBuilder().width(CORNER_PANEL).height(CORNER_PANEL).xAxisTitle(xTitle)
                .yAxisTitle(yTitle).build();
        PlotFiles.style(ch);
        ch.getStyler().setChartTitleVisible(false);
        ch.getStyler().setLegendVisible(false);
        ch.getStyler().setAxisTitleFont(new java.awt.Font(java.awt.Font.SANS_SERIF, java.awt.Font.PLAIN, 10));
        ch.getStyler().setAxisTickLabelsFont(new java.awt.Font(java.awt.Font.SANS_SERIF, java.awt.Font.PLAIN, 8));
        ch.getStyler().setXAxisDecimalPattern("0.####");
        ch.getStyler().setYAxisDecimalPattern("0.####");
        ch.getStyler().setChartPadding(2);
        return ch;
    }

    private static XYChart histogram(Posterior p, double[] v, double[] range, int c, Axis axis, boolean bottom) {
        int bins = 40;
        double w = (range[1] - range[0]) / bins;
        double[] counts = new double[bins];
        for (double x : v) {
            int b = (int) Math.floor((x - range[0]) / w);
            if (b >= 0 && b < bins) {
                counts[b]++;
            }
        }
        double[] xs = new double[2 * bins + 2];
        double[] ys = new double[2 * bins + 2];
        xs[0] = range[0];
        for (int b = 0; b < bins; b++) {
            xs[2 * b + 1] = range[0] + b * w;
            ys[2 * b + 1] = counts[b];
            xs[2 * b + 2] = range[0] + (b + 1) * w;
            ys[2 * b + 2] = counts[b];
        }
        xs[2 * bins + 1] = range[1];
        double top = Arrays.stream(counts).max().orElse(1) * 1.1;
        XYChart ch = panel(axis, null, bottom, false);
        ch.getStyler().setYAxisTicksVisible(false);
        line(ch, "histogram", xs, ys, PlotFiles.SECOND, 1.2f);
        Marginal m = p.marginals().get(c);
        double median = m.median() - axis.shift();
        line(ch, "median", new double[] {median, median}, new double[] {0, top}, PlotFiles.MODEL, 1.2f);
        for (double q : new double[] {m.lower68() - axis.shift(), m.upper68() - axis.shift()}) {
            dashed(line(ch, "68% " + q, new double[] {q, q}, new double[] {0, top}, PlotFiles.MODEL, 1f));
        }
        ch.getStyler().setXAxisMin(range[0]).setXAxisMax(range[1]).setYAxisMin(0.0).setYAxisMax(top);
        return ch;
    }

    private static XYChart pair(double[] x, double[] y, double[] rx, double[] ry, Axis ax, Axis ay, boolean bottom,
            boolean left) {
        XYChart ch = panel(ax, ay, bottom, left);
        int stride = Math.max(1, x.length / SCATTER_POINTS);
        int n = x.length / stride;
        double[] sx = new double[n];
        double[] sy = new double[n];
        for (int i = 0; i < n; i++) {
            sx[i] = x[i * stride];
            sy[i] = y[i * stride];
        }
        XYSeries pts = ch.addSeries("samples", sx, sy);
        pts.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
        pts.setMarker(SeriesMarkers.CIRCLE);
        pts.setMarkerColor(SAMPLE);
        ch.getStyler().setMarkerSize(2);
        double[][] density = density(x, y, rx, ry);
        double[] levels = CredibleLevels.of(density, new double[] {0.68, 0.95});
        double[][] c95 = Contours.at(density, levels[1], rx, ry);
        double[][] c68 = Contours.at(density, levels[0], rx, ry);
        if (c95[0].length > 0) {
            line(ch, "95%", c95[0], c95[1], PlotFiles.SECOND, 1.2f);
        }
        if (c68[0].length > 0) {
            line(ch, "68%", c68[0], c68[1], PlotFiles.MODEL, 1.4f);
        }
        ch.getStyler().setXAxisMin(rx[0]).setXAxisMax(rx[1]).setYAxisMin(ry[0]).setYAxisMax(ry[1]);
        return ch;
    }

    /** A 2-D histogram on a GRID × GRID lattice over the ranges, smoothed by a 1-2-1 kernel in each direction. */
    private static double[][] density(double[] x, double[] y, double[] rx, double[] ry) {
        double[][] h = new double[GRID][GRID];
        for (int i = 0; i < x.length; i++) {
            int a = (int) Math.floor((x[i] - rx[0]) / (rx[1] - rx[0]) * GRID);
            int b = (int) Math.floor((y[i] - ry[0]) / (ry[1] - ry[0]) * GRID);
            if (a >= 0 && a < GRID && b >= 0 && b < GRID) {
                h[a][b]++;
            }
        }
        double[][] s = new double[GRID][GRID];
        for (int a = 0; a < GRID; a++) {
            for (int b = 0; b < GRID; b++) {
                double sum = 0;
                for (int da = -1; da <= 1; da++) {
                    for (int db = -1; db <= 1; db++) {
                        int ia = a + da;
                        int ib = b + db;
                        if (ia >= 0 && ia < GRID && ib >= 0 && ib < GRID) {
                            sum += h[ia][ib] * (2 - Math.abs(da)) * (2 - Math.abs(db));
                        }
                    }
                }
                s[a][b] = sum / 16;
            }
        }
        return s;
    }

    private static XYSeries line(XYChart ch, String name, double[] x, double[] y, Color color, float width) {
        XYSeries s = ch.addSeries(name, x, y);
        s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
        s.setMarker(SeriesMarkers.NONE);
        s.setLineColor(color);
        s.setLineWidth(width);
        return s;
    }

    private static void dashed(XYSeries s) {
        s.setLineStyle(new java.awt.BasicStroke(1f, java.awt.BasicStroke.CAP_BUTT, java.awt.BasicStroke.JOIN_MITER,
                10f, new float[] {4f, 3f}, 0f));
    }

    /** Density levels enclosing given fractions of the total (highest-density regions of a histogram). */
    static final class CredibleLevels {
        private CredibleLevels() {
        }

        static double[] of(double[][] density, double[] fractions) {
            List<Double> cells = new ArrayList<>();
            double total = 0;
            for (double[] row : density) {
                for (double v : row) {
                    cells.add(v);
                    total += v;
                }
            }
            cells.sort((a, b) -> Double.compare(b, a));
            double[] out = new double[fractions.length];
            for (int f = 0; f < fractions.length; f++) {
                double cum = 0;
                out[f] = cells.get(cells.size() - 1);
                for (double v : cells) {
                    cum += v;
                    if (cum >= fractions[f] * total) {
                        out[f] = v;
                        break;
                    }
                }
            }
            return out;
        }
    }

    /**
     * Contour lines of a lattice by marching squares (Lorensen &amp; Cline 1987, SIGGRAPH 21, 163, in
     * two dimensions), as one polyline of segments separated by NaN gaps.
     */
    static final class Contours {
        private Contours() {
        }

        static double[][] at(double[][] f, double level, double[] rx, double[] ry) {
            int n = f.length;
            double dx = (rx[1] - rx[0]) / n;
            double dy = (ry[1] - ry[0]) / n;
            List<double[]> pts = new ArrayList<>();
            for (int a = 0; a + 1 < n; a++) {
                for (int b = 0; b + 1 < n; b++) {
                    double[] v = {f[a][b], f[a + 1][b], f[a + 1][b + 1], f[a][b + 1]};
                    double[][] corner = {{a, b}, {a + 1, b}, {a + 1, b + 1}, {a, b + 1}};
                    List<double[]> cross = new ArrayList<>();
                    for (int e = 0; e < 4; e++) {
                        double v0 = v[e];
                        double v1 = v[(e + 1) % 4];
                        if ((v0 >= level) != (v1 >= level)) {
                            double t = (level - v0) / (v1 - v0);
                            double[] c0 = corner[e];
                            double[] c1 = corner[(e + 1) % 4];
                            cross.add(new double[] {c0[0] + t * (c1[0] - c0[0]), c0[1] + t * (c1[1] - c0[1])});
                        }
                    }
                    for (int s = 0; s + 1 < cross.size(); s += 2) {
                        pts.add(cross.get(s));
                        pts.add(cross.get(s + 1));
                        pts.add(null);
                    }
                }
            }
            double[] xs = new double[pts.size()];
            double[] ys = new double[pts.size()];
            for (int i = 0; i < pts.size(); i++) {
                double[] q = pts.get(i);
                // lattice index i stands for the centre of cell i
                xs[i] = q == null ? Double.NaN : rx[0] + (q[0] + 0.5) * dx;
                ys[i] = q == null ? Double.NaN : ry[0] + (q[1] + 0.5) * dy;
            }
            if (xs.length > 0) {
                // XChart draws a gap at NaN y; the x of a gap must still be a number
                for (int i = 0; i < xs.length; i++) {
                    if (Double.isNaN(xs[i])) {
                        xs[i] = xs[i - 1];
                    }
                }
            }
            return new double[][] {xs, ys};
        }
    }
}

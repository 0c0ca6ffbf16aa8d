package org.twinlight.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.nio.file.Path;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.Marker;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.twinlight.velocity.StarVelocities;
import org.twinlight.velocity.VelocityData;
import org.twinlight.velocity.VelocityFitResult;
import org.twinlight.velocity.VelocityModel;
import org.twinlight.velocity.VelocityParameters;

/**
 * {@code velocities.png}: both stars' velocities (instrument offsets removed) against orbital
 * phase with the model curves, and the residuals below. Star 1 in blue circles, star 2 in
 * vermillion diamonds (Okabe &amp; Ito 2008 colour-blind-safe pair), so the stars differ by
 * shape as well as colour.
 */
public final class VelocityPlot {

    /** Star 1: blue of the Okabe–Ito palette. */
    public static final Color STAR1 = new Color(0x00, 0x72, 0xB2);
    /** Star 2: vermillion of the Okabe–Ito palette. */
    public static final Color STAR2 = new Color(0xD5, 0x5E, 0x00);
    private static final int WIDTH = 900;

    private VelocityPlot() {
    }

    public static void write(VelocityFitResult r, VelocityData data, Path target, String title) {
        write(r.best(), data, target, title);
    }

    /** The plot of {@code data} against the model {@code p} (e.g. the velocities of a joint fit's solution). */
    public static void write(VelocityParameters p, VelocityData data, Path target, String title) {
        VelocityModel.Residuals res = VelocityModel.residuals(data, p);
        XYChart top = chart(WIDTH, 460, title, null, "radial velocity (km/s)");
        XYChart bottom = chart(WIDTH, 260, null, "orbital phase (0 = primary eclipse)", "observed - model (km/s)");
        int steps = 400;
        double[] ph = new double[steps + 1];
        double[] t = new double[steps + 1];
        for (int i = 0; i <= steps; i++) {
            ph[i] = (double) i / steps;
            t[i] = p.epochDays() + ph[i] * p.periodDays();
        }
        line(top, "model, star 1", ph, VelocityModel.curve(t, 1, p), STAR1);
        line(top, "model, star 2", ph, VelocityModel.curve(t, 2, p), STAR2);
        points(top, "star 1", data.star1(), p, res.residual1(), STAR1, SeriesMarkers.CIRCLE, false);
        points(top, "star 2", data.star2(), p, res.residual2(), STAR2, SeriesMarkers.DIAMOND, false);
        line(top, "systemic velocity", new double[] {0, 1}, new double[] {p.gammaKms(), p.gammaKms()},
                Color.GRAY);
        points(bottom, "star 1", data.star1(), p, res.residual1(), STAR1, SeriesMarkers.CIRCLE, true);
        points(bottom, "star 2", data.star2(), p, res.residual2(), STAR2, SeriesMarkers.DIAMOND, true);
        line(bottom, "zero", new double[] {0, 1}, new double[] {0, 0}, Color.GRAY);
        bottom.getStyler().setLegendVisible(false);
        // as many characters in the residual panel's tick labels as in the top panel's, so the two
        // plot areas start at the same place and the phase axes line up
        double topMax = Math.abs(p.gammaKms()) + Math.max(p.k1Kms(), p.k2Kms()) * (1 + p.eccentricity());
        double bottomMax = Math.max(maxAbs(res.residual1()), maxAbs(res.residual2()));
        int extra = Math.max(0, integerDigits(topMax) - integerDigits(bottomMax));
        bottom.getStyler().setYAxisDecimalPattern("0.0" + "0".repeat(Math.min(3, extra)));
        PlotFiles.writeStackedPng(target, WIDTH, top, bottom);
    }

    private static double maxAbs(double[] v) {
        double m = 0;
        for (double x : v) {
            m = Math.max(m, Math.abs(x));
        }
        return m;
    }

    private static int integerDigits(double v) {
        return v < 10 ? 1 : (int) Math.floor(Math.log10(v)) + 1;
    }

    private static XYChart chart(int w, int h, String title, String x, String y) {
        XYChart c = new XYChartBuilder().width(w).height(h).title(title == null ? "" : title)
                .xAxisTitle(x == null ? "" : x).yAxisTitle(y).build();
        PlotFiles.style(c);
        c.getStyler().setChartTitleVisible(title != null);
        c.getStyler().setMarkerSize(7);
        c.getStyler().setXAxisMin(0.0).setXAxisMax(1.0);
        c.getStyler().setXAxisDecimalPattern("0.0#");
        c.getStyler().setLegendPosition(org.knowm.xchart.style.Styler.LegendPosition.OutsideS);
        c.getStyler().setLegendLayout(org.knowm.xchart.style.Styler.LegendLayout.Horizontal);
        c.getStyler().setErrorBarsColorSeriesColor(true);
        c.getStyler().setYAxisDecimalPattern("0.0");
        return c;
    }

    private static void points(XYChart c, String name, StarVelocities s, VelocityParameters p, double[] residual,
            Color colour, Marker marker, boolean residuals) {
        if (s.size() == 0) {
            return;
        }
        double[] x = new double[s.size()];
        double[] y = new double[s.size()];
        double[] e = new double[s.size()];
        for (int i = 0; i < x.length; i++) {
            double ph = (s.timesDays()[i] - p.epochDays()) / p.periodDays();
            x[i] = ph - Math.floor(ph);
            y[i] = residuals ? residual[i] : s.velocitiesKms()[i] - p.offsetKms(s.instruments()[i]);
            e[i] = s.hasErrors() ? s.errorsKms()[i] : 0.0;
        }
        XYSeries series = s.hasErrors() ? c.addSeries(name, x, y, e) : c.addSeries(name, x, y);
        series.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
        series.setMarker(marker);
        series.setMarkerColor(colour);
        series.setLineColor(colour);
    }

    private static void line(XYChart c, String name, double[] x, double[] y, Color colour) {
        XYSeries s = c.addSeries(name, x, y);
        s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
        s.setMarker(SeriesMarkers.NONE);
        s.setLineColor(colour);
        s.setLineWidth(1.6f);
        if (colour == Color.GRAY) {
            s.setLineStyle(new BasicStroke(1f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, new float[] {6f, 4f},
                    0f));
        }
    }
}

package org.twinlight.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.twinlight.time.TimeScale;
import org.twinlight.timing.minima.EphemerisFit;
import org.twinlight.timing.minima.EphemerisModel;
import org.twinlight.timing.MinimumType;
import org.twinlight.timing.minima.OcPoint;
import org.twinlight.timing.minima.OcResult;

/**
 * The O−C diagram as a PNG: O−C in minutes against cycle number, primary minima as filled
 * circles and secondary minima as diamonds in another colour (triangles for partly covered
 * eclipses), each with its 1σ error bar; the
 * fitted linear ephemeris drawn as the answer ("no significant period change") unless a quadratic
 * or light-time model passed the strong-evidence and physical checks of the O−C analysis; then
 * that curve is the thick one and the linear ephemeris a thin grey line.
 */
public final class OcPlot {
    private static final double MINUTES_PER_DAY = 1440.0;
    private static final int CURVE_POINTS = 400;

    private OcPlot() {
    }

    /**
     * Writes the plot.
     *
     * @param target the PNG file
     * @param points the O−C points (against {@code reference})
     * @param result the fitted models, or null to plot the points alone
     * @param referenceText the reference ephemeris, for the title (e.g. "T0 = 2460000.1234, P = 2.5 d")
     * @param timeScale time scale of the times
     * @param method the method of the timings, for the legend
     * @param secondaryPhase phase of the secondary minima that were measured: their O−C (points and
     *     curves) is drawn against that phase instead of 0.5, so that the displaced secondary of an
     *     eccentric orbit does not stretch the axis over the whole displacement
     * @param periodDays period of the reference ephemeris, days
     */
    public static void write(Path target, List<OcPoint> points, OcResult result, String referenceText,
            TimeScale timeScale, String method, double secondaryPhase, double periodDays) {
        double shift = secondaryPhase == 0.5 ? 0 : (secondaryPhase - 0.5) * periodDays;
        String yTitle = shift == 0 ? "O−C (minutes)" : String.format(Locale.ROOT,
                "O−C (minutes; secondaries against phase %.4f, %.2f min after phase 0.5)", secondaryPhase,
                shift * MINUTES_PER_DAY);
        XYChart chart = new XYChartBuilder().width(960).height(680)
                .title("O−C against " + referenceText + " (" + timeScale.label() + ")")
                .xAxisTitle("cycle E").yAxisTitle(yTitle).build();
        PlotFiles.style(chart);
        // Outside the plot: O−C points can lie anywhere, an inside legend would hide some.
        chart.getStyler().setLegendPosition(Styler.LegendPosition.OutsideS);
        chart.getStyler().setLegendLayout(Styler.LegendLayout.Vertical);
        chart.getStyler().setMarkerSize(7);
        chart.getStyler().setErrorBarsColorSeriesColor(true);
        chart.getStyler().setYAxisDecimalPattern("0.##");
        double minE = points.stream().mapToDouble(OcPoint::cycle).min().orElse(0);
        double maxE = points.stream().mapToDouble(OcPoint::cycle).max().orElse(1);
        if (result != null) {
            EphemerisFit preferred = result.preferredFit();
            boolean linearAnswer = preferred.model() == EphemerisModel.LINEAR;
            addCurve(chart, result.linear(), MinimumType.PRIMARY, 0, minE, maxE,
                    linearAnswer ? "linear ephemeris: no significant period change" : "linear ephemeris",
                    linearAnswer ? Color.DARK_GRAY : Color.GRAY, linearAnswer ? 2.2f : 1.2f);
            // The linear fit's secondary line only where the linear ephemeris is the answer: under an
            // accepted period change its offset means nothing. A fixed offset is dashed, so that a line
            // at zero offset does not hide the primary one beneath it.
            result.linear().parameter("secondaryOffset").filter(offset -> linearAnswer).ifPresent(offset -> {
                boolean fixed = result.secondaryOffsetFixed();
                XYSeries line = addCurve(chart, result.linear(), MinimumType.SECONDARY, shift, minE, maxE,
                        String.format(Locale.ROOT, "linear ephemeris, secondary minima (offset %s %.2f min%s)",
                                fixed ? "fixed at" : "fitted:", offset.value() * MINUTES_PER_DAY,
                                fixed ? ", from the folded light curve" : ""), PlotFiles.SECOND.brighter(), 1.6f);
                if (fixed) {
                    line.setLineStyle(new BasicStroke(1.6f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f,
                            new float[] {8f, 6f}, 0f));
                }
            });
            if (!linearAnswer) {
                String name = String.format(Locale.ROOT, "%s (ΔBIC = %.1f against linear, > %.0f; checks passed)",
                        preferred.model() == EphemerisModel.QUADRATIC ? "quadratic ephemeris" : "light-time orbit",
                        result.linear().bic() - preferred.bic(), OcResult.strongEvidenceDeltaBic());
                addCurve(chart, preferred, MinimumType.PRIMARY, 0, minE, maxE, name, PlotFiles.MODEL, 2.2f);
                if (significantSecondaryOffset(preferred)) {
                    addCurve(chart, preferred, MinimumType.SECONDARY, shift, minE, maxE, "same, secondary minima",
                            PlotFiles.SECOND, 1.6f);
                }
            }
        }
        addPoints(chart, points, MinimumType.PRIMARY, 0, false, "primary (" + method + ")", PlotFiles.MODEL.darker(),
                SeriesMarkers.CIRCLE);
        addPoints(chart, points, MinimumType.SECONDARY, shift, false, "secondary (" + method + ")", PlotFiles.SECOND,
                SeriesMarkers.DIAMOND);
        addPoints(chart, points, MinimumType.PRIMARY, 0, true, "primary, partly covered (template only)",
                PlotFiles.MODEL.darker(), SeriesMarkers.TRIANGLE_UP);
        addPoints(chart, points, MinimumType.SECONDARY, shift, true, "secondary, partly covered (template only)",
                PlotFiles.SECOND, SeriesMarkers.TRIANGLE_DOWN);
        PlotFiles.writePng(chart, target);
    }

    /** Secondaries get their own curve only when their offset from phase 0.5 exceeds 2σ. */
    private static boolean significantSecondaryOffset(EphemerisFit fit) {
        return fit.parameter("secondaryOffset")
                .map(p -> Math.abs(p.value()) > 2 * p.uncertainty())
                .orElse(false);
    }

    private static void addPoints(XYChart chart, List<OcPoint> points, MinimumType type, double shiftDays,
            boolean partial, String name, Color color, org.knowm.xchart.style.markers.Marker marker) {
        List<OcPoint> sel = points.stream().filter(p -> p.type() == type && p.partial() == partial).toList();
        if (sel.isEmpty()) {
            return;
        }
        double[] x = sel.stream().mapToDouble(OcPoint::cycle).toArray();
        double[] y = sel.stream().mapToDouble(p -> (p.ocDays() - shiftDays) * MINUTES_PER_DAY).toArray();
        double[] e = sel.stream().mapToDouble(p -> p.errorDays() * MINUTES_PER_DAY).toArray();
        XYSeries s = chart.addSeries(String.format(Locale.ROOT, "%s, n = %d", name, sel.size()), x, y, e);
        s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
        s.setMarker(marker);
        s.setMarkerColor(color);
        s.setLineColor(color);
    }

    private static XYSeries addCurve(XYChart chart, EphemerisFit fit, MinimumType type, double shiftDays,
            double minE, double maxE, String name, Color color, float width) {
        double span = Math.max(maxE - minE, 1);
        double from = minE - 0.03 * span;
        double to = maxE + 0.03 * span;
        // A straight line as one segment: many short ones are drawn as steps of whole pixels.
        int count = fit.model() == EphemerisModel.LINEAR ? 2 : CURVE_POINTS;
        double[] x = new double[count];
        double[] y = new double[count];
        for (int i = 0; i < count; i++) {
            x[i] = from + (to - from) * i / (count - 1);
            y[i] = (fit.ocModelDays(x[i], type) - shiftDays) * MINUTES_PER_DAY;
        }
        XYSeries s = chart.addSeries(name, x, y);
        s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
        s.setMarker(SeriesMarkers.NONE);
        s.setLineColor(color);
        s.setLineStyle(new BasicStroke(width));
        return s;
    }
}

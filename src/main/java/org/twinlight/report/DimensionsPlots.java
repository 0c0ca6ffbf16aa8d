package org.twinlight.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.nio.file.Path;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.Marker;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.twinlight.dimensions.AstronomicalConstants;
import org.twinlight.dimensions.DimensionEstimate;
import org.twinlight.dimensions.DimensionsPropagation;
import org.twinlight.dimensions.MassLuminosityRelation;
import org.twinlight.dimensions.Quantity;

/**
 * The two stars in the mass–radius plane (with lines of constant surface gravity, exact from
 * g = GM/R²) and in the mass–luminosity plane (with the main-sequence relation of Eker et al.
 * 2018), each with its 1σ error bars; the colours and markers of {@link VelocityPlot}. The
 * legend gives each star's values with their errors, since bars smaller than the marker (masses
 * from good velocities often are) cannot be seen.
 */
public final class DimensionsPlots {

    private static final int WIDTH = 760;
    private static final int HEIGHT = 560;

    private DimensionsPlots() {
    }

    /** {@code mass-radius.png}. */
    public static void massRadius(DimensionsPropagation.Result r, Path target, String title) {
        XYChart c = chart(title, "mass (nominal solar masses)", "radius (nominal solar radii)");
        double[] range = massRange(r);
        double[] loggs = {3.5, 4.0, 4.5, 5.0};
        for (double logg : loggs) {
            int n = 50;
            double[] m = new double[n];
            double[] rad = new double[n];
            for (int i = 0; i < n; i++) {
                m[i] = range[0] * Math.pow(range[1] / range[0], i / (n - 1.0));
                // R = √(GM/g): g in cm s⁻² → m s⁻² by /100
                double g = Math.pow(10, logg) / 100.0;
                rad[i] = Math.sqrt(AstronomicalConstants.IAU_2015_NOMINAL_SOLAR_MASS_PARAMETER_M3_S2 * m[i] / g)
                        / AstronomicalConstants.IAU_2015_NOMINAL_SOLAR_RADIUS_M;
            }
            line(c, "log g = " + logg, m, rad, new Color(0x99, 0x99, 0x99), logg == 4.0 || logg == 5.0);
        }
        star(c, "star 1", "R", r.estimates().get(Quantity.MASS1), r.estimates().get(Quantity.RADIUS1),
                VelocityPlot.STAR1, SeriesMarkers.CIRCLE);
        star(c, "star 2", "R", r.estimates().get(Quantity.MASS2), r.estimates().get(Quantity.RADIUS2),
                VelocityPlot.STAR2, SeriesMarkers.DIAMOND);
        PlotFiles.writePng(c, target);
    }

    /** {@code mass-luminosity.png}; needs the luminosities. */
    public static void massLuminosity(DimensionsPropagation.Result r, Path target, String title) {
        XYChart c = chart(title, "mass (nominal solar masses)", "log10 luminosity (nominal solar luminosities)");
        double[] range = massRange(r);
        double lo = Math.max(range[0], MassLuminosityRelation.MIN_MASS * 1.0001);
        double hi = Math.min(range[1], MassLuminosityRelation.MAX_MASS);
        if (hi > lo) {
            int n = 200;
            double[] m = new double[n];
            double[] l = new double[n];
            for (int i = 0; i < n; i++) {
                m[i] = lo * Math.pow(hi / lo, i / (n - 1.0));
                l[i] = MassLuminosityRelation.logLuminosity(m[i]);
            }
            line(c, "main sequence (Eker et al. 2018)", m, l, new Color(0x55, 0x55, 0x55), false);
        }
        star(c, "star 1", "log L", r.estimates().get(Quantity.MASS1), r.estimates().get(Quantity.LOG_LUMINOSITY1),
                VelocityPlot.STAR1, SeriesMarkers.CIRCLE);
        star(c, "star 2", "log L", r.estimates().get(Quantity.MASS2), r.estimates().get(Quantity.LOG_LUMINOSITY2),
                VelocityPlot.STAR2, SeriesMarkers.DIAMOND);
        PlotFiles.writePng(c, target);
    }

    /** A mass range around both stars: a factor 2 beyond the lighter and the heavier. */
    private static double[] massRange(DimensionsPropagation.Result r) {
        double m1 = r.estimates().get(Quantity.MASS1).value();
        double m2 = r.estimates().get(Quantity.MASS2).value();
        return new double[] {Math.min(m1, m2) / 2, Math.max(m1, m2) * 2};
    }

    private static XYChart chart(String title, String x, String y) {
        XYChart c = new XYChartBuilder().width(WIDTH).height(HEIGHT).title(title).xAxisTitle(x).yAxisTitle(y).build();
        PlotFiles.style(c);
        c.getStyler().setMarkerSize(10);
        c.getStyler().setErrorBarsColorSeriesColor(true);
        c.getStyler().setLegendPosition(org.knowm.xchart.style.Styler.LegendPosition.InsideNW);
        return c;
    }

    private static void star(XYChart c, String star, String yName, DimensionEstimate x, DimensionEstimate y,
            Color colour, Marker marker) {
        if (x == null || y == null) {
            return;
        }
        String name = star + ": M = " + DimensionsFiles.rounded(x) + ", " + yName + " = " + DimensionsFiles.rounded(y)
                + " (1σ bars)";
        // XChart draws only vertical error bars: the mass error is drawn as a short horizontal line
        XYSeries s = c.addSeries(name, new double[] {x.value()}, new double[] {y.value()},
                new double[] {y.uncertainty()});
        s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
        s.setMarker(marker);
        s.setMarkerColor(colour);
        s.setLineColor(colour);
        XYSeries h = c.addSeries(name + " mass error", new double[] {x.value() - x.uncertainty(),
            x.value() + x.uncertainty()}, new double[] {y.value(), y.value()});
        h.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
        h.setMarker(SeriesMarkers.NONE);
        h.setLineColor(colour);
        h.setLineWidth(1.5f);
        h.setShowInLegend(false);
    }

    private static void line(XYChart c, String name, double[] x, double[] y, Color colour, boolean dashed) {
        XYSeries s = c.addSeries(name, x, y);
        s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
        s.setMarker(SeriesMarkers.NONE);
        s.setLineColor(colour);
        s.setLineWidth(1.2f);
        if (dashed) {
            s.setLineStyle(new BasicStroke(1.2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f,
                    new float[] {6f, 4f}, 0f));
        }
    }
}

package org.twinlight.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.twinlight.planning.Plan;
import org.twinlight.planning.PlanningTarget;
import org.twinlight.planning.Prediction;
import org.twinlight.planning.Verdict;
import org.twinlight.sky.AltitudeCrossings;
import org.twinlight.sky.Equatorial;
import org.twinlight.sky.Horizontal;
import org.twinlight.sky.Precession;
import org.twinlight.sky.SiderealTime;
import org.twinlight.sky.SunPlace;
import org.twinlight.time.JulianDate;
import org.twinlight.time.SunAndMoon;
import org.twinlight.time.TimeScale;

/**
 * The plan as a PNG. Up to {@value #TRACK_DAYS_MAX} days: the targets' altitude tracks against UTC,
 * the dark hours shaded (Sun below the limit; darker below −18°), the altitude limit, and each
 * eclipse from first to last contact drawn thick on its target's track (solid whole, dashed
 * partial, thin not observable). Longer ranges: a night calendar, date against time of night
 * (UTC), with the dark hours between the evening and morning crossings of the Sun limit and each
 * eclipse a vertical bar coloured by verdict. Colours from the Okabe–Ito palette, which readers with
 * the common colour-vision deficiencies tell apart (Okabe &amp; Ito 2002, "Color Universal Design").
 */
public final class PlanChart {

    /** Ranges up to this many days get altitude tracks; longer ones the night calendar. */
    static final int TRACK_DAYS_MAX = 7;

    /** Okabe–Ito colours: blue, vermillion, bluish green, reddish purple, orange, sky blue, yellow, black. */
    static final Color[] OKABE_ITO = {new Color(0x00, 0x72, 0xB2), new Color(0xD5, 0x5E, 0x00),
        new Color(0x00, 0x9E, 0x73), new Color(0xCC, 0x79, 0xA7), new Color(0xE6, 0x9F, 0x00),
        new Color(0x56, 0xB4, 0xE9), new Color(0xF0, 0xE4, 0x42), Color.BLACK};

    /** Up to this many minima the night calendar shows the not-observable ones too. */
    static final int CALENDAR_ALL_MAX = 150;

    private static final Color DARK = new Color(0x30, 0x30, 0x50, 45);
    private static final Color DARKEST = new Color(0x30, 0x30, 0x50, 60);
    private static final double HOURS_PER_DAY = 24.0;

    private PlanChart() {
    }

    /** Writes the chart atomically. */
    public static void write(Path target, Plan plan) {
        XYChart chart = plan.range().days() <= TRACK_DAYS_MAX ? tracks(plan) : calendar(plan);
        PlotFiles.writePng(chart, target);
    }

    // ---------------------------------------------------------------- altitude tracks

    private static XYChart tracks(Plan plan) {
        double jd0 = plan.range().startJd();
        double hours = plan.range().days() * HOURS_PER_DAY;
        XYChart chart = new XYChartBuilder().width(1250).height(620)
                .title(String.format(Locale.ROOT, "Minima seen from %.2f°, %.2f° (%s to %s, 0h UTC)",
                        plan.site().latitudeDeg(), plan.site().longitudeDeg(), plan.range().start(), plan.range().end()))
                .xAxisTitle("time (UTC, month-day hh:mm)").yAxisTitle("altitude (°, geometric)").build();
        PlotFiles.style(chart);
        chart.getStyler().setLegendPosition(Styler.LegendPosition.OutsideE);
        chart.getStyler().setLegendLayout(Styler.LegendLayout.Vertical);
        chart.getStyler().setYAxisMin(0.0).setYAxisMax(90.0).setXAxisMin(0.0).setXAxisMax(hours);
        chart.getStyler().setMarkerSize(0);
        LocalDate start = plan.range().start();
        DateTimeFormatter f = DateTimeFormatter.ofPattern("MM-dd HH:mm", Locale.ROOT);
        chart.setCustomXAxisTickLabelsFormatter(x -> f.format(start.atStartOfDay().plusMinutes(Math.round(x * 60))));

        int n = (int) Math.ceil(hours * 12);
        double[] x = new double[n + 1];
        double[] dark = new double[n + 1];
        double[] darkest = new double[n + 1];
        SunPlace sun = null;
        for (int i = 0; i <= n; i++) {
            x[i] = i / 12.0;
            JulianDate t = JulianDate.of(jd0 + x[i] / HOURS_PER_DAY, TimeScale.JD_UTC);
            if (i % 72 == 0) {
                sun = SunPlace.at(t);
            }
            double alt = Horizontal.altitudeDeg(sun.direction(), plan.site().latitudeDeg(),
                    SiderealTime.localMeanDeg(t, plan.site()));
            dark[i] = alt <= plan.limits().sunBelowDeg() ? 90 : 0;
            darkest[i] = alt <= -18 ? 90 : 0;
        }
        area(chart, "Sun below " + degrees(plan.limits().sunBelowDeg()), x, dark, DARK);
        if (plan.limits().sunBelowDeg() > -18) {
            area(chart, "Sun below −18°", x, darkest, DARKEST);
        }
        XYSeries limit = chart.addSeries(String.format(Locale.ROOT, "altitude limit %.0f°", plan.limits().minAltitudeDeg()),
                new double[] {0, hours}, new double[] {plan.limits().minAltitudeDeg(), plan.limits().minAltitudeDeg()});
        styleLine(limit, Color.DARK_GRAY, dashed(1.2f));

        for (Verdict v : Verdict.values()) {
            // a key for the line style of each verdict: one point outside the fixed axis range, so nothing is drawn
            XYSeries key = chart.addSeries("eclipse, " + v.label(), new double[] {-1e6}, new double[] {-1e6});
            styleLine(key, Color.GRAY, eclipseStroke(v));
        }
        List<PlanningTarget> targets = plan.targets();
        for (int k = 0; k < targets.size(); k++) {
            PlanningTarget tg = targets.get(k);
            Color c = OKABE_ITO[k % OKABE_ITO.length];
            double[] alt = new double[n + 1];
            Equatorial j2000 = new Equatorial(tg.direction().raDeg(), tg.direction().decDeg());
            Equatorial ofDate = Precession.fromJ2000(j2000, SunAndMoon.centuriesSinceJ2000(
                    JulianDate.of(jd0, TimeScale.JD_UTC)));
            for (int i = 0; i <= n; i++) {
                JulianDate t = JulianDate.of(jd0 + x[i] / HOURS_PER_DAY, TimeScale.JD_UTC);
                double a = Horizontal.altitudeDeg(ofDate, plan.site().latitudeDeg(), SiderealTime.localMeanDeg(t, plan.site()));
                alt[i] = a;
            }
            XYSeries s = chart.addSeries(tg.name(), x, alt);
            styleLine(s, c, new BasicStroke(1.2f));
            if (k >= 8) {
                s.setShowInLegend(false);
            }
            for (Verdict v : Verdict.values()) {
                List<Prediction> mine = plan.predictions().stream()
                        .filter(p -> p.target().equals(tg.name()) && p.verdict() == v).toList();
                if (!mine.isEmpty()) {
                    eclipseSegments(chart, tg.name() + " " + v.label(), mine, jd0, ofDate, plan, c, v);
                }
            }
        }
        return chart;
    }

    private static void eclipseSegments(XYChart chart, String name, List<Prediction> events, double jd0,
            Equatorial ofDate, Plan plan, Color c, Verdict v) {
        List<Double> xs = new ArrayList<>();
        List<Double> ys = new ArrayList<>();
        for (Prediction p : events) {
            double a = (p.start().utc().jd() - jd0) * HOURS_PER_DAY;
            double b = (p.end().utc().jd() - jd0) * HOURS_PER_DAY;
            for (double h = a; h < b + 1e-9; h = Math.min(b, h + 1.0 / 12) + (h >= b ? 1 : 0)) {
                JulianDate t = JulianDate.of(jd0 + h / HOURS_PER_DAY, TimeScale.JD_UTC);
                xs.add(h);
                ys.add(Horizontal.altitudeDeg(ofDate, plan.site().latitudeDeg(), SiderealTime.localMeanDeg(t, plan.site())));
            }
            xs.add(b);
            ys.add(null);
        }
        XYSeries s = chart.addSeries(name, xs, ys);
        s.setShowInLegend(false);
        styleLine(s, c, eclipseStroke(v));
    }

    private static BasicStroke eclipseStroke(Verdict v) {
        return switch (v) {
            case WHOLE -> new BasicStroke(6f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND);
            case PARTIAL -> new BasicStroke(6f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10f, new float[] {8f, 5f}, 0f);
            case NOT_OBSERVABLE -> new BasicStroke(2.5f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10f,
                    new float[] {2f, 3f}, 0f);
        };
    }

    // ---------------------------------------------------------------- night calendar

    private static XYChart calendar(Plan plan) {
        double jd0 = plan.range().startJd();
        long days = plan.range().days();
        // time of night: UTC hours from 0h of the date after the evening, centred on local mean midnight
        double midnight = -plan.site().longitudeDeg() / 15.0;
        double lo = midnight - 12;
        double hi = midnight + 12;
        boolean many = plan.predictions().size() > CALENDAR_ALL_MAX;
        XYChart chart = new XYChartBuilder().width(1100).height(640)
                .title(String.format(Locale.ROOT, "Minima seen from %.2f°, %.2f°: %s to %s (target ≥ %.0f°)%s",
                        plan.site().latitudeDeg(), plan.site().longitudeDeg(), plan.range().start(), plan.range().end(),
                        plan.limits().minAltitudeDeg(), many ? "; not-observable minima left out" : ""))
                .xAxisTitle("date of the evening (UTC)")
                .yAxisTitle("UTC, hours from the midnight after that evening (−3 = 21:00)").build();
        PlotFiles.style(chart);
        chart.getStyler().setLegendPosition(Styler.LegendPosition.OutsideS);
        chart.getStyler().setLegendLayout(Styler.LegendLayout.Horizontal);
        chart.getStyler().setYAxisMin(lo).setYAxisMax(hi).setXAxisMin(-0.5).setXAxisMax(days - 0.5);
        chart.getStyler().setYAxisDecimalPattern("+0;−0");
        chart.getStyler().setMarkerSize(0);
        LocalDate start = plan.range().start();
        chart.setCustomXAxisTickLabelsFormatter(x -> start.plusDays(Math.round(x)).toString());

        List<Double> dx = new ArrayList<>();
        List<Double> dusk = new ArrayList<>();
        List<Double> dawn = new ArrayList<>();
        for (long d = 0; d < days; d++) {
            double from = jd0 + d + 1 + lo / HOURS_PER_DAY;
            SunPlace sun = SunPlace.at(JulianDate.of(from + 0.5, TimeScale.JD_UTC));
            List<AltitudeCrossings.Crossing> cs = AltitudeCrossings.find(jd -> Horizontal.altitudeDeg(sun.direction(),
                    plan.site().latitudeDeg(), SiderealTime.localMeanDeg(JulianDate.of(jd, TimeScale.JD_UTC), plan.site())),
                    from, from + 1, plan.limits().sunBelowDeg(), 1.0 / 24);
            double evening = Double.NaN;
            double morning = Double.NaN;
            for (AltitudeCrossings.Crossing c : cs) {
                double y = (c.jd() - (jd0 + d + 1)) * HOURS_PER_DAY;
                if (!c.rising() && Double.isNaN(evening)) {
                    evening = y;
                } else if (c.rising()) {
                    morning = y;
                }
            }
            dx.add((double) d);
            dusk.add(Double.isNaN(evening) ? null : evening);
            dawn.add(Double.isNaN(morning) ? null : morning);
        }
        String sunLabel = "Sun at " + degrees(plan.limits().sunBelowDeg());
        XYSeries ev = chart.addSeries(sunLabel + " (evening)", dx, dusk);
        styleLine(ev, Color.DARK_GRAY, new BasicStroke(1.5f));
        XYSeries mo = chart.addSeries(sunLabel + " (morning)", dx, dawn);
        styleLine(mo, Color.DARK_GRAY, dashed(1.5f));

        Color[] byVerdict = {OKABE_ITO[2], OKABE_ITO[4], new Color(0x99, 0x99, 0x99)};
        for (Verdict v : Verdict.values()) {
            List<Double> xs = new ArrayList<>();
            List<Double> ys = new ArrayList<>();
            for (Prediction p : plan.predictions()) {
                if (p.verdict() != v || (many && v == Verdict.NOT_OBSERVABLE)) {
                    continue;
                }
                double dayOf = Math.floor(p.minimum().utc().jd() - jd0 - 1 - lo / HOURS_PER_DAY);
                double a = (p.start().utc().jd() - (jd0 + dayOf + 1)) * HOURS_PER_DAY;
                double b = (p.end().utc().jd() - (jd0 + dayOf + 1)) * HOURS_PER_DAY;
                xs.add(dayOf);
                ys.add(a);
                xs.add(dayOf);
                ys.add(b);
                xs.add(dayOf);
                ys.add(null);
            }
            if (xs.isEmpty()) {
                continue;
            }
            XYSeries s = chart.addSeries("eclipse, " + v.label(), xs, ys);
            float width = (float) Math.max(1.5, Math.min(6, 700.0 / days));
            styleLine(s, byVerdict[v.ordinal()], new BasicStroke(v == Verdict.NOT_OBSERVABLE ? Math.max(1f, width / 3) : width,
                            BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND));
        }
        return chart;
    }

    private static void area(XYChart chart, String name, double[] x, double[] y, Color c) {
        XYSeries s = chart.addSeries(name, x, y);
        s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.StepArea);
        s.setFillColor(c);
        styleLine(s, c, new BasicStroke(0.5f));
    }

    private static void styleLine(XYSeries s, Color c, BasicStroke stroke) {
        s.setLineColor(c);
        s.setLineStyle(stroke);
        s.setMarker(SeriesMarkers.NONE);
    }

    /** Signed whole degrees with a true minus sign. */
    private static String degrees(double deg) {
        return String.format(Locale.ROOT, "%+.0f°", deg).replace('-', '−');
    }

    private static BasicStroke dashed(float width) {
        return new BasicStroke(width, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10f, new float[] {6f, 4f}, 0f);
    }
}

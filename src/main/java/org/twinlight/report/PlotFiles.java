package org.twinlight.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.internal.chartpart.Chart;
import org.knowm.xchart.style.Styler;

/** The house style of twinlight's plots and the atomic PNG writer they share. */
public final class PlotFiles {
    /** Data points. */
    public static final Color DATA = new Color(0x44, 0x55, 0x66, 110);
    /** Model curves and fitted lines. */
    public static final Color MODEL = new Color(0xC0, 0x39, 0x2B);
    /** Secondary series: secondary eclipses, runners-up. */
    public static final Color SECOND = new Color(0x1F, 0x77, 0xB4);
    /** Third series. */
    public static final Color THIRD = new Color(0x2C, 0xA0, 0x2C);

    private PlotFiles() {
    }

    /** Applies the house style: white background, light grid, no chart border, readable fonts. */
    public static void style(XYChart chart) {
        org.knowm.xchart.style.XYStyler s = chart.getStyler();
        s.setChartBackgroundColor(Color.WHITE);
        s.setPlotBackgroundColor(Color.WHITE);
        s.setPlotBorderVisible(true);
        s.setPlotBorderColor(Color.GRAY);
        s.setPlotGridLinesColor(new Color(0xE4, 0xE4, 0xE4));
        s.setPlotGridLinesStroke(new BasicStroke(1f));
        s.setChartTitleFont(new Font(Font.SANS_SERIF, Font.BOLD, 14));
        s.setAxisTitleFont(new Font(Font.SANS_SERIF, Font.PLAIN, 12));
        s.setLegendFont(new Font(Font.SANS_SERIF, Font.PLAIN, 11));
        s.setLegendBorderColor(Color.LIGHT_GRAY);
        s.setLegendPosition(Styler.LegendPosition.InsideNE);
        s.setChartTitleBoxVisible(false);
        s.setAntiAlias(true);
    }

    /** Writes a chart as a PNG file atomically. */
    public static void writePng(Chart<?, ?> chart, Path target) {
        try {
            ByteArrayOutputStream buf = new ByteArrayOutputStream();
            BitmapEncoder.saveBitmap(chart, buf, BitmapEncoder.BitmapFormat.PNG);
            AtomicFiles.writeBytes(target, buf.toByteArray());
        } catch (IOException e) {
            throw new UncheckedIOException("cannot render " + target + ": " + e.getMessage(), e);
        }
    }

    /** Writes charts stacked top to bottom, each at its own height, as one PNG file atomically. */
    public static void writeStackedPng(Path target, int width, XYChart... charts) {
        int height = 0;
        for (XYChart c : charts) {
            height += c.getHeight();
        }
        java.awt.image.BufferedImage img = new java.awt.image.BufferedImage(width, height,
                java.awt.image.BufferedImage.TYPE_INT_RGB);
        java.awt.Graphics2D g = img.createGraphics();
        g.setColor(Color.WHITE);
        g.fillRect(0, 0, width, height);
        int y = 0;
        for (XYChart c : charts) {
            g.drawImage(BitmapEncoder.getBufferedImage(c), 0, y, null);
            y += c.getHeight();
        }
        g.dispose();
        writeImage(img, target);
    }

    /** Writes an image composed of several charts as a PNG file atomically. */
    public static void writeImage(java.awt.image.BufferedImage img, Path target) {
        try {
            ByteArrayOutputStream buf = new ByteArrayOutputStream();
            javax.imageio.ImageIO.write(img, "png", buf);
            AtomicFiles.writeBytes(target, buf.toByteArray());
        } catch (IOException e) {
            throw new UncheckedIOException("cannot render " + target + ": " + e.getMessage(), e);
        }
    }
}

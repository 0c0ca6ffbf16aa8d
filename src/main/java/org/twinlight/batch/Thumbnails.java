package org.twinlight.batch;

import java.awt.Graphics2D;
import java.awt.Image;
import java.awt.RenderingHints;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import javax.imageio.ImageIO;
import org.twinlight.report.AtomicFiles;

/** Reduced copies of the targets' pictures, so that an index of many targets loads quickly. */
final class Thumbnails {
    private Thumbnails() {
    }

    /**
     * Writes {@code picture} reduced to {@code width} pixels (keeping its aspect ratio) to
     * {@code target}, atomically.
     *
     * @return true when the reduced copy was written; false when the picture is already that small
     *     or cannot be read as an image (the index then shows the picture itself, or none)
     */
    static boolean reduce(Path picture, Path target, int width) {
        BufferedImage in;
        try {
            in = ImageIO.read(picture.toFile());
        } catch (IOException e) {
            return false;
        }
        if (in == null || in.getWidth() <= width) {
            return false;
        }
        int height = Math.max(1, Math.round((float) in.getHeight() * width / in.getWidth()));
        BufferedImage out = new BufferedImage(width, height, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = out.createGraphics();
        try {
            g.setRenderingHint(RenderingHints.KEY_RENDERING, RenderingHints.VALUE_RENDER_QUALITY);
            // area averaging keeps thin plot lines and small points visible at a fraction of the size
            Image scaled = in.getScaledInstance(width, height, Image.SCALE_AREA_AVERAGING);
            g.drawImage(scaled, 0, 0, java.awt.Color.WHITE, null);
        } finally {
            g.dispose();
        }
        try {
            AtomicFiles.write(target, o -> ImageIO.write(out, "png", o));
            return true;
        } catch (UncheckedIOException e) {
            return false;
        }
    }
}

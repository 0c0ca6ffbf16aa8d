package org.twinlight.report;

import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.FileSystemException;
import java.nio.file.NoSuchFileException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.PosixFilePermissions;

/**
 * Writes result files atomically: the content goes to a temporary file in the same directory,
 * which is then moved over the target, so a crash never leaves a half-written result.
 */
public final class AtomicFiles {

    /** Something that writes the whole content of a file to a stream. */
    @FunctionalInterface
    public interface Content {
        void writeTo(OutputStream out) throws IOException;
    }

    private AtomicFiles() {
    }

    /** Writes text (UTF-8) to {@code target} atomically. */
    public static void writeString(Path target, String text) {
        write(target, out -> out.write(text.getBytes(StandardCharsets.UTF_8)));
    }

    /** Writes bytes to {@code target} atomically. */
    public static void writeBytes(Path target, byte[] bytes) {
        write(target, out -> out.write(bytes));
    }

    /**
     * Writes {@code content} to {@code target} atomically, creating the parent directory if needed.
     *
     * @throws UncheckedIOException when the file cannot be written
     */
    public static void write(Path target, Content content) {
        Path abs = target.toAbsolutePath();
        Path dir = abs.getParent();
        try {
            Files.createDirectories(dir);
            Path tmp = Files.createTempFile(dir, "." + abs.getFileName() + ".", ".part");
            try {
                try (OutputStream out = Files.newOutputStream(tmp)) {
                    content.writeTo(out);
                }
                // temporary files are created private; results are ordinary readable files
                if (Files.getFileStore(tmp).supportsFileAttributeView("posix")) {
                    Files.setPosixFilePermissions(tmp, PosixFilePermissions.fromString("rw-r--r--"));
                }
                try {
                    Files.move(tmp, abs, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
                } catch (AtomicMoveNotSupportedException e) {
                    Files.move(tmp, abs, StandardCopyOption.REPLACE_EXISTING);
                }
            } finally {
                Files.deleteIfExists(tmp);
            }
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write " + target + ": " + reason(e), e);
        }
    }

    /** The reason of an input/output failure in words a user can act on, without library class names. */
    public static String reason(IOException e) {
        if (e instanceof AccessDeniedException) {
            return "permission denied (" + e.getMessage() + ")";
        }
        if (e instanceof NoSuchFileException) {
            return "no such file or directory (" + e.getMessage() + ")";
        }
        if (e instanceof FileAlreadyExistsException) {
            return "a file of that name is in the way (" + e.getMessage() + ")";
        }
        if (e instanceof FileSystemException f && f.getReason() != null) {
            return f.getReason() + (f.getFile() != null ? " (" + f.getFile() + ")" : "");
        }
        String m = e.getMessage();
        return m == null || m.isBlank() ? "an input/output error" : m;
    }
}

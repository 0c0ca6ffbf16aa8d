package org.twinlight.photometry;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

/** Writes small input files for reader tests. */
final class TestFiles {

    private TestFiles() {
    }

    /** Writes {@code content} (UTF-8) to {@code dir/name} and returns the path. */
    static Path text(Path dir, String name, String content) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, content, StandardCharsets.UTF_8);
        return p;
    }
}

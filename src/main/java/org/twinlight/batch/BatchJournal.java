package org.twinlight.batch;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.twinlight.WorkFailedException;
import org.twinlight.report.AtomicFiles;

/**
 * The batch's journal: one line of JSON per finished target, appended and forced to the disk
 * before the target counts as done. It is the only state the threads of a batch share.
 *
 * <p>A target is finished when its line is on the disk; its result files were committed before
 * (the unit of work returns after its result set is in place). A run killed at any moment leaves
 * whole lines for every finished target and at most one torn last line, which is ignored (that
 * target is redone). Lines are never rewritten: a target redone later (e.g. with
 * {@code --retry-failed}) gets a new line, and the last line of a target counts.
 */
public final class BatchJournal implements AutoCloseable {
    /** The journal's file name inside the batch's output folder. */
    public static final String FILE_NAME = ".twinlight-batch.jsonl";

    private static final ObjectMapper MAPPER = new ObjectMapper();

    private final Path file;
    private final FileChannel channel;

    /**
     * One finished target as the journal records it.
     *
     * @param id the target's id
     * @param fingerprint the target description's fingerprint when it ran
     * @param result what the unit of work returned (or the failure recorded for it)
     * @param seconds the time the target took, seconds
     */
    public record Entry(String id, String fingerprint, TargetResult result, double seconds) {
    }

    private BatchJournal(Path file, FileChannel channel) {
        this.file = file;
        this.channel = channel;
    }

    /** Opens (creating if missing) the journal in {@code batchDir} for appending. */
    public static BatchJournal open(Path batchDir) {
        Path f = batchDir.resolve(FILE_NAME);
        try {
            Files.createDirectories(batchDir);
            FileChannel ch = FileChannel.open(f, StandardOpenOption.CREATE, StandardOpenOption.READ,
                    StandardOpenOption.WRITE);
            return new BatchJournal(f, ch);
        } catch (IOException e) {
            throw new WorkFailedException("cannot write the batch journal " + f + ": " + AtomicFiles.reason(e)
                    + "; choose another --out");
        }
    }

    /**
     * Appends the entry as one line and forces it to the disk. Called by every worker thread, one
     * at a time; a line starts on a fresh line even after a torn line of a killed run.
     */
    public synchronized void append(Entry e) {
        try {
            byte[] line = (toJson(e) + "\n").getBytes(StandardCharsets.UTF_8);
            if (channel.size() > 0 && lastByte() != '\n') {
                write(new byte[] {'\n'});
            }
            write(line);
            channel.force(false);
        } catch (IOException ex) {
            throw new WorkFailedException("cannot write the batch journal " + file + ": " + AtomicFiles.reason(ex)
                    + "; the batch stopped, run it again to resume");
        }
    }

    private byte lastByte() throws IOException {
        ByteBuffer b = ByteBuffer.allocate(1);
        channel.read(b, channel.size() - 1);
        return b.get(0);
    }

    /** Writes at the end of the file (appends are serialised by {@link #append}). */
    private void write(byte[] bytes) throws IOException {
        ByteBuffer b = ByteBuffer.wrap(bytes);
        long at = channel.size();
        while (b.hasRemaining()) {
            at += channel.write(b, at);
        }
    }

    @Override
    public synchronized void close() {
        try {
            channel.close();
        } catch (IOException e) {
            // every line was forced when written
        }
    }

    /**
     * The finished targets recorded in the journal of {@code batchDir} (the last line of each
     * target), in the order they finished; none when there is no journal. Lines that cannot be
     * read (the torn last line of a killed run) are skipped.
     */
    public static Map<String, Entry> read(Path batchDir) {
        Path f = batchDir.resolve(FILE_NAME);
        Map<String, Entry> entries = new LinkedHashMap<>();
        if (!Files.isRegularFile(f)) {
            return entries;
        }
        List<String> lines;
        try {
            lines = Files.readAllLines(f, StandardCharsets.UTF_8);
        } catch (java.nio.charset.CharacterCodingException e) {
            throw new WorkFailedException("the batch journal " + f + " is damaged (not UTF-8 text); "
                    + "start the batch with a fresh --out");
        } catch (IOException e) {
            throw new WorkFailedException("cannot read the batch journal " + f + ": " + AtomicFiles.reason(e));
        }
        for (String line : lines) {
            Entry e = parse(line);
            if (e != null) {
                entries.remove(e.id());
                entries.put(e.id(), e);
            }
        }
        return entries;
    }

    /** The journal line of an entry (one line of JSON, without the line break). */
    public static String toJson(Entry e) {
        ObjectNode root = MAPPER.createObjectNode();
        root.put("target", e.id());
        root.put("fingerprint", e.fingerprint());
        TargetResult r = e.result();
        root.put("exitCode", r.exitCode());
        root.put("message", r.message());
        ObjectNode results = root.putObject("results");
        r.keyResults().forEach((name, v) -> {
            ObjectNode o = results.putObject(name);
            number(o, "value", v.value());
            number(o, "uncertainty", v.uncertainty());
        });
        ArrayNode files = root.putArray("files");
        r.files().forEach(files::add);
        if (r.thumbnail() != null) {
            root.put("thumbnail", r.thumbnail());
        }
        root.put("seconds", e.seconds());
        try {
            return MAPPER.writeValueAsString(root);
        } catch (JsonProcessingException ex) {
            throw new IllegalStateException("cannot write a journal line", ex);
        }
    }

    private static void number(ObjectNode o, String name, double v) {
        if (Double.isFinite(v)) {
            o.put(name, v);
        } else {
            o.putNull(name);
        }
    }

    /** The entry of one line, or null when the line is not a whole entry. */
    public static Entry parse(String line) {
        if (line.isBlank()) {
            return null;
        }
        try {
            JsonNode n = MAPPER.readTree(line);
            if (n == null || !n.hasNonNull("target") || !n.hasNonNull("exitCode") || !n.hasNonNull("message")
                    || !n.hasNonNull("seconds")) {
                return null;
            }
            Map<String, TargetResult.KeyValue> results = new LinkedHashMap<>();
            n.path("results").fields().forEachRemaining(f -> results.put(f.getKey(), new TargetResult.KeyValue(
                    value(f.getValue().get("value")), value(f.getValue().get("uncertainty")))));
            List<String> files = new ArrayList<>();
            n.path("files").forEach(x -> files.add(x.asText()));
            String thumbnail = n.hasNonNull("thumbnail") ? n.get("thumbnail").asText() : null;
            int code = n.get("exitCode").asInt();
            if (code < 0 || code > 2) {
                return null;
            }
            return new Entry(n.get("target").asText(), n.path("fingerprint").asText(""),
                    new TargetResult(code, n.get("message").asText(), results, files, thumbnail),
                    n.get("seconds").asDouble());
        } catch (JsonProcessingException | IllegalArgumentException e) {
            return null;
        }
    }

    private static double value(JsonNode n) {
        return n == null || !n.isNumber() ? Double.NaN : n.asDouble();
    }
}

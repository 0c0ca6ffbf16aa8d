package org.twinlight.report;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import org.twinlight.BadInputException;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.time.TimeScale;

/**
 * A model given to a command: a model file (JSON, as in the interface contract) or a
 * {@code fit.json}, whose {@code "model"} is read the same way and whose {@code "timeScale"}
 * says on which scale its epoch is. The one place commands read a model through, so the
 * model-file reader can move without touching them.
 *
 * @param model the model
 * @param timeScale the time scale of its epoch, {@link TimeScale#UNKNOWN} when the file does
 *     not say (a plain model file)
 * @param file where it came from
 */
public record ModelInput(ModelFile model, TimeScale timeScale, Path file) {

    private static final ObjectMapper JSON = new ObjectMapper();

    /**
     * Reads a model file or a {@code fit.json}.
     *
     * @throws BadInputException naming the file and key when it cannot be used
     */
    public static ModelInput read(Path file) {
        JsonNode root = readJson(file);
        if (root.has("parameters") && root.has("model")) {
            return new ModelInput(ModelFileJson.parse(root.get("model"), file), timeScale(root, file), file);
        }
        return new ModelInput(ModelFileJson.read(file), TimeScale.UNKNOWN, file);
    }

    /** The JSON document in {@code file}. */
    static JsonNode readJson(Path file) {
        try {
            JsonNode root = JSON.readTree(file.toFile());
            if (root == null || !root.isObject()) {
                throw BadInputException.at(file, null, null, "expected a JSON object");
            }
            return root;
        } catch (NoSuchFileException e) {
            throw BadInputException.at(file, null, null, "no such file");
        } catch (java.io.FileNotFoundException e) {
            throw BadInputException.at(file, null, null, "no such file");
        } catch (com.fasterxml.jackson.core.JsonProcessingException e) {
            throw BadInputException.at(file, null, null, "not valid JSON (" + e.getOriginalMessage() + ")");
        } catch (IOException e) {
            throw BadInputException.at(file, null, null, "cannot read the file (" + e.getMessage() + ")");
        }
    }

    /** The {@code "timeScale"} of a result file, UNKNOWN when absent or "unknown". */
    static TimeScale timeScale(JsonNode root, Path file) {
        JsonNode s = root.get("timeScale");
        if (s == null || s.isNull()) {
            return TimeScale.UNKNOWN;
        }
        return TimeScale.parse(s.asText()).orElseThrow(() -> BadInputException.at(file, "key 'timeScale'", null,
                "unknown time scale '" + s.asText() + "'; expected one of " + TimeScale.acceptedLabels()));
    }
}

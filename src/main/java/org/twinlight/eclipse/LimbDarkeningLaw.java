package org.twinlight.eclipse;

import java.util.Arrays;
import java.util.Locale;
import java.util.Optional;

/**
 * The seven limb-darkening laws of the interface contract, with I(μ=1) = 1 and μ the cosine of
 * the angle between the line of sight and the surface normal:
 * <ul>
 * <li>{@code uniform}: 1</li>
 * <li>{@code linear}: 1 − u(1−μ)</li>
 * <li>{@code quadratic}: 1 − a(1−μ) − b(1−μ)²</li>
 * <li>{@code square-root}: 1 − c(1−μ) − d(1−√μ)</li>
 * <li>{@code logarithmic}: 1 − e(1−μ) − f·μ·ln μ</li>
 * <li>{@code power-2}: 1 − c(1−μ^α), coefficients [c, α]</li>
 * <li>{@code four-parameter}: 1 − Σₖ aₖ(1−μ^(k/2)), k = 1..4</li>
 * </ul>
 */
public enum LimbDarkeningLaw {
    UNIFORM("uniform"),
    LINEAR("linear", "u"),
    QUADRATIC("quadratic", "a", "b"),
    SQUARE_ROOT("square-root", "c", "d"),
    LOGARITHMIC("logarithmic", "e", "f"),
    POWER_2("power-2", "c", "alpha"),
    FOUR_PARAMETER("four-parameter", "a1", "a2", "a3", "a4");

    private final String fileName;
    private final String[] coefficientNames;

    LimbDarkeningLaw(String fileName, String... coefficientNames) {
        this.fileName = fileName;
        this.coefficientNames = coefficientNames;
    }

    /** The name used in model files, e.g. {@code square-root}. */
    public String fileName() {
        return fileName;
    }

    /** How many coefficients the law takes. */
    public int coefficientCount() {
        return coefficientNames.length;
    }

    /** Short names of the coefficients in order, e.g. [c, alpha] for power-2. */
    public String[] coefficientNames() {
        return coefficientNames.clone();
    }

    /** The law named {@code name} in a model file (case-insensitive), if any. */
    public static Optional<LimbDarkeningLaw> byFileName(String name) {
        if (name == null) {
            return Optional.empty();
        }
        String n = name.trim().toLowerCase(Locale.ROOT);
        return Arrays.stream(values()).filter(l -> l.fileName.equals(n)).findFirst();
    }

    /** The accepted names, for messages. */
    public static String acceptedNames() {
        return String.join(", ", Arrays.stream(values()).map(LimbDarkeningLaw::fileName).toArray(String[]::new));
    }
}

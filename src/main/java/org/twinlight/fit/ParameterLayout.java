package org.twinlight.fit;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import org.twinlight.BadInputException;
import org.twinlight.eclipse.BandValues;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.eclipse.ModelFile;

/**
 * Maps between the model's parameters in the contract's units ("external": period, epoch, radii,
 * degrees, ...) and the solver's unbounded internal coordinates, in which the bounds hold by
 * construction:
 * <ul>
 * <li>both radii free: ln(r₁+r₂) and ln(r₂/r₁) (sum and ratio are far less correlated than
 * r₁ and r₂ for a detached pair); one radius: ln r</li>
 * <li>inclination: y = cos i, i = arccos |y|, so 0° ≤ i ≤ 90° (the flux depends on cos² i only)</li>
 * <li>eccentricity and ω: (ξ, η) = artanh(e)·(cos ω, sin ω), close to (e cos ω, e sin ω) for small
 * e and always giving 0 ≤ e &lt; 1; eccentricity alone: artanh e</li>
 * <li>surface-brightness ratio: ln J; third light: logit ℓ₃</li>
 * <li>epoch: offset from the starting epoch; period, ω alone and limb-darkening coefficients: as they are</li>
 * </ul>
 */
final class ParameterLayout {
    static final int PERIOD = 0;
    static final int EPOCH = 1;
    static final int RADIUS1 = 2;
    static final int RADIUS2 = 3;
    static final int INCLINATION = 4;
    static final int ECCENTRICITY = 5;
    static final int OMEGA = 6;
    private static final int COMMON_COUNT = 7;
    /** Where a bounded transform cannot start on its bound, it starts this far inside. */
    static final double THIRD_LIGHT_FLOOR = 0.01;
    static final double ECCENTRICITY_FLOOR = 1e-4;

    private static final String[] COMMON_NAMES = {"period", "epoch", "radius1", "radius2", "inclination",
        "eccentricity", "omega"};

    private final ModelFile start;
    private final List<String> bands;
    private final int[] bandOffset;
    private final BinaryParameters[] bandStart;
    private final String[] names;
    private final String[] nameBands;
    private final boolean[] free;
    private final List<Block> blocks = new ArrayList<>();
    private final int internalSize;
    private final List<String> adjustments = new ArrayList<>();

    ParameterLayout(ModelFile start, List<String> bands, Set<String> freeNames) {
        this.start = start;
        this.bands = List.copyOf(bands);
        this.bandOffset = new int[bands.size()];
        this.bandStart = new BinaryParameters[bands.size()];
        List<String> n = new ArrayList<>(Arrays.asList(COMMON_NAMES));
        List<String> nb = new ArrayList<>();
        for (int i = 0; i < COMMON_COUNT; i++) {
            nb.add(null);
        }
        for (int b = 0; b < bands.size(); b++) {
            bandStart[b] = start.forBand(bands.get(b));
            bandOffset[b] = n.size();
            n.add("surfaceBrightnessRatio");
            n.add("thirdLight");
            for (String c : bandStart[b].limbDarkening1().law().coefficientNames()) {
                n.add("limbDarkening1." + c);
            }
            for (String c : bandStart[b].limbDarkening2().law().coefficientNames()) {
                n.add("limbDarkening2." + c);
            }
            while (nb.size() < n.size()) {
                nb.add(bands.get(b));
            }
        }
        names = n.toArray(String[]::new);
        nameBands = nb.toArray(String[]::new);
        free = new boolean[names.length];
        markFree(freeNames);
        buildBlocks();
        internalSize = blocks.stream().mapToInt(Block::size).sum();
    }

    private void markFree(Set<String> freeNames) {
        Set<String> known = new LinkedHashSet<>(Arrays.asList(COMMON_NAMES));
        known.addAll(List.of("surfaceBrightnessRatio", "thirdLight", "limbDarkening1", "limbDarkening2"));
        for (String f : freeNames) {
            boolean matched = false;
            for (int i = 0; i < names.length; i++) {
                if (names[i].equals(f) || (f.equals("limbDarkening1") || f.equals("limbDarkening2"))
                        && names[i].startsWith(f + ".")) {
                    free[i] = true;
                    matched = true;
                }
            }
            if (!matched) {
                boolean ldName = f.startsWith("limbDarkening1.") || f.startsWith("limbDarkening2.");
                throw new BadInputException("option --free: unknown parameter '" + f + "'; "
                        + (ldName ? "the limb-darkening law of that star has coefficients "
                                + coefficientList(f.substring(0, 14)) + " (or the law takes none)"
                                : "expected names from " + String.join(", ", known)
                                        + ", or limbDarkening1.NAME / limbDarkening2.NAME for one coefficient"));
            }
        }
    }

    private String coefficientList(String star) {
        LinkedHashSet<String> s = new LinkedHashSet<>();
        for (int i = 0; i < names.length; i++) {
            if (names[i].startsWith(star + ".")) {
                s.add(names[i]);
            }
        }
        return s.isEmpty() ? "none" : String.join(", ", s);
    }

    private void buildBlocks() {
        double[] ext = startExternal();
        if (free[PERIOD]) {
            blocks.add(new Identity(PERIOD, 1e-7 * ext[PERIOD]));
        }
        if (free[EPOCH]) {
            // as an offset from the starting epoch: a Julian date's size would swamp the solver's
            // relative step tests
            blocks.add(new Offset(EPOCH, ext[EPOCH], 2e-6 * ext[PERIOD]));
        }
        if (free[RADIUS1] && free[RADIUS2]) {
            blocks.add(new RadiusPair());
        } else if (free[RADIUS1]) {
            blocks.add(new Logarithm(RADIUS1));
        } else if (free[RADIUS2]) {
            blocks.add(new Logarithm(RADIUS2));
        }
        if (free[INCLINATION]) {
            blocks.add(new CosInclination());
        }
        if (free[ECCENTRICITY] && free[OMEGA]) {
            blocks.add(new EccentricityVector());
        } else if (free[ECCENTRICITY]) {
            blocks.add(new EccentricityOnly());
        } else if (free[OMEGA]) {
            blocks.add(new Identity(OMEGA, 1e-3));
        }
        for (int b = 0; b < bands.size(); b++) {
            int off = bandOffset[b];
            if (free[off]) {
                blocks.add(new Logarithm(off));
            }
            if (free[off + 1]) {
                blocks.add(new Logit(off + 1));
            }
            int nLd = bandStart[b].limbDarkening1().coefficientCount() + bandStart[b].limbDarkening2().coefficientCount();
            for (int k = 0; k < nLd; k++) {
                if (free[off + 2 + k]) {
                    blocks.add(new Identity(off + 2 + k, 1e-4));
                }
            }
        }
        if (free[ECCENTRICITY] && ext[ECCENTRICITY] < ECCENTRICITY_FLOOR) {
            adjustments.add("eccentricity started at " + ECCENTRICITY_FLOOR + " instead of "
                    + ext[ECCENTRICITY] + " (its transform cannot start on the bound e = 0)");
        }
        for (int b = 0; b < bands.size(); b++) {
            if (free[bandOffset[b] + 1] && ext[bandOffset[b] + 1] < THIRD_LIGHT_FLOOR) {
                adjustments.add("thirdLight" + bandSuffix(b) + " started at " + THIRD_LIGHT_FLOOR + " instead of "
                        + ext[bandOffset[b] + 1] + " (its transform cannot start on the bound 0)");
            }
        }
    }

    private String bandSuffix(int b) {
        return bands.size() > 1 ? " (band " + bands.get(b) + ")" : "";
    }

    /** Notes on starting values moved off a bound. */
    List<String> adjustments() {
        return List.copyOf(adjustments);
    }

    List<String> bands() {
        return bands;
    }

    int externalSize() {
        return names.length;
    }

    int internalSize() {
        return internalSize;
    }

    String name(int i) {
        return names[i];
    }

    String band(int i) {
        return nameBands[i];
    }

    boolean isFree(int i) {
        return free[i];
    }

    /** The starting model as an external vector. */
    double[] startExternal() {
        BinaryParameters c = start.common();
        double[] ext = new double[names.length];
        ext[PERIOD] = c.periodDays();
        ext[EPOCH] = c.epochDays();
        ext[RADIUS1] = c.radius1();
        ext[RADIUS2] = c.radius2();
        ext[INCLINATION] = c.inclinationDeg();
        ext[ECCENTRICITY] = c.eccentricity();
        ext[OMEGA] = c.omegaDeg();
        for (int b = 0; b < bands.size(); b++) {
            BinaryParameters p = bandStart[b];
            int off = bandOffset[b];
            ext[off] = p.surfaceBrightnessRatio();
            ext[off + 1] = p.thirdLight();
            int k = off + 2;
            for (double v : p.limbDarkening1().coefficients()) {
                ext[k++] = v;
            }
            for (double v : p.limbDarkening2().coefficients()) {
                ext[k++] = v;
            }
        }
        return ext;
    }

    /** The internal starting vector (bounded values moved off their bounds). */
    double[] startInternal() {
        double[] ext = startExternal();
        if (free[ECCENTRICITY]) {
            ext[ECCENTRICITY] = Math.max(ext[ECCENTRICITY], ECCENTRICITY_FLOOR);
        }
        for (int b = 0; b < bands.size(); b++) {
            if (free[bandOffset[b] + 1]) {
                ext[bandOffset[b] + 1] = Math.max(ext[bandOffset[b] + 1], THIRD_LIGHT_FLOOR);
            }
        }
        double[] in = new double[internalSize];
        int off = 0;
        for (Block blk : blocks) {
            blk.fromExternal(ext, in, off);
            off += blk.size();
        }
        return in;
    }

    /** External vector for an internal one (fixed parameters at their starting values). */
    double[] toExternal(double[] internal) {
        double[] ext = startExternal();
        int off = 0;
        for (Block blk : blocks) {
            blk.toExternal(internal, off, ext);
            off += blk.size();
        }
        return ext;
    }

    /** Finite-difference steps for the internal coordinates. */
    double[] steps() {
        double[] h = new double[internalSize];
        int off = 0;
        for (Block blk : blocks) {
            for (int k = 0; k < blk.size(); k++) {
                h[off + k] = blk.step(k);
            }
            off += blk.size();
        }
        return h;
    }

    /** Names of the internal coordinates, for messages. */
    List<String> internalNames() {
        List<String> out = new ArrayList<>();
        for (Block blk : blocks) {
            out.addAll(blk.names());
        }
        return out;
    }

    /** Model parameters of band b for an external vector. */
    BinaryParameters parameters(double[] ext, int b) {
        BinaryParameters c = start.common();
        BinaryParameters p = new BinaryParameters(ext[PERIOD], ext[EPOCH], ext[RADIUS1], ext[RADIUS2],
                ext[INCLINATION], ext[ECCENTRICITY], ext[OMEGA], c.surfaceBrightnessRatio(), c.thirdLight(),
                c.limbDarkening1(), c.limbDarkening2(), c.exposureTimeDays(), c.supersample());
        return bandValues(ext, b).applyTo(p);
    }

    BandValues bandValues(double[] ext, int b) {
        int off = bandOffset[b];
        LimbDarkening ld1 = bandStart[b].limbDarkening1();
        LimbDarkening ld2 = bandStart[b].limbDarkening2();
        double[] c1 = Arrays.copyOfRange(ext, off + 2, off + 2 + ld1.coefficientCount());
        double[] c2 = Arrays.copyOfRange(ext, off + 2 + c1.length, off + 2 + c1.length + ld2.coefficientCount());
        return new BandValues(ext[off], ext[off + 1], ld1.withCoefficients(c1), ld2.withCoefficients(c2));
    }

    /** One or more internal coordinates standing for one or more external parameters. */
    private interface Block {
        int size();

        void toExternal(double[] in, int off, double[] ext);

        void fromExternal(double[] ext, double[] in, int off);

        double step(int k);

        List<String> names();
    }

    private final class Identity implements Block {
        private final int index;
        private final double step;

        Identity(int index, double step) {
            this.index = index;
            this.step = step;
        }

        public int size() {
            return 1;
        }

        public void toExternal(double[] in, int off, double[] ext) {
            ext[index] = in[off];
        }

        public void fromExternal(double[] ext, double[] in, int off) {
            in[off] = ext[index];
        }

        public double step(int k) {
            return step;
        }

        public List<String> names() {
            return List.of(label(index));
        }
    }

    private final class Offset implements Block {
        private final int index;
        private final double origin;
        private final double step;

        Offset(int index, double origin, double step) {
            this.index = index;
            this.origin = origin;
            this.step = step;
        }

        public int size() {
            return 1;
        }

        public void toExternal(double[] in, int off, double[] ext) {
            ext[index] = origin + in[off];
        }

        public void fromExternal(double[] ext, double[] in, int off) {
            in[off] = ext[index] - origin;
        }

        public double step(int k) {
            return step;
        }

        public List<String> names() {
            return List.of(label(index) + " offset");
        }
    }

    private final class Logarithm implements Block {
        private final int index;

        Logarithm(int index) {
            this.index = index;
        }

        public int size() {
            return 1;
        }

        public void toExternal(double[] in, int off, double[] ext) {
            ext[index] = Math.exp(in[off]);
        }

        public void fromExternal(double[] ext, double[] in, int off) {
            in[off] = Math.log(ext[index]);
        }

        public double step(int k) {
            return 1e-5;
        }

        public List<String> names() {
            return List.of("ln " + label(index));
        }
    }

    private final class Logit implements Block {
        private final int index;

        Logit(int index) {
            this.index = index;
        }

        public int size() {
            return 1;
        }

        public void toExternal(double[] in, int off, double[] ext) {
            ext[index] = 1 / (1 + Math.exp(-in[off]));
        }

        public void fromExternal(double[] ext, double[] in, int off) {
            double v = ext[index];
            in[off] = Math.log(v / (1 - v));
        }

        public double step(int k) {
            return 1e-4;
        }

        public List<String> names() {
            return List.of("logit " + label(index));
        }
    }

    private static final class RadiusPair implements Block {
        public int size() {
            return 2;
        }

        public void toExternal(double[] in, int off, double[] ext) {
            double sum = Math.exp(in[off]);
            double k = Math.exp(in[off + 1]);
            ext[RADIUS1] = sum / (1 + k);
            ext[RADIUS2] = sum * k / (1 + k);
        }

        public void fromExternal(double[] ext, double[] in, int off) {
            in[off] = Math.log(ext[RADIUS1] + ext[RADIUS2]);
            in[off + 1] = Math.log(ext[RADIUS2] / ext[RADIUS1]);
        }

        public double step(int k) {
            return 1e-5;
        }

        public List<String> names() {
            return List.of("ln sumOfRadii", "ln radiusRatio");
        }
    }

    private static final class CosInclination implements Block {
        public int size() {
            return 1;
        }

        public void toExternal(double[] in, int off, double[] ext) {
            ext[INCLINATION] = Math.toDegrees(Math.acos(Math.min(1.0, Math.abs(in[off]))));
        }

        public void fromExternal(double[] ext, double[] in, int off) {
            double i = ext[INCLINATION];
            in[off] = Math.abs(Math.cos(Math.toRadians(i)));
        }

        public double step(int k) {
            return 1e-5;
        }

        public List<String> names() {
            return List.of("cos inclination");
        }
    }

    private static final class EccentricityVector implements Block {
        public int size() {
            return 2;
        }

        public void toExternal(double[] in, int off, double[] ext) {
            double xi = in[off];
            double eta = in[off + 1];
            double rho = Math.hypot(xi, eta);
            ext[ECCENTRICITY] = Math.tanh(rho);
            if (rho > 0) {
                ext[OMEGA] = Math.toDegrees(Math.atan2(eta, xi));
            }
        }

        public void fromExternal(double[] ext, double[] in, int off) {
            double a = atanh(ext[ECCENTRICITY]);
            double w = Math.toRadians(ext[OMEGA]);
            in[off] = a * Math.cos(w);
            in[off + 1] = a * Math.sin(w);
        }

        public double step(int k) {
            return 1e-5;
        }

        public List<String> names() {
            return List.of("artanh(e) cos omega", "artanh(e) sin omega");
        }
    }

    private static final class EccentricityOnly implements Block {
        public int size() {
            return 1;
        }

        public void toExternal(double[] in, int off, double[] ext) {
            ext[ECCENTRICITY] = Math.tanh(Math.abs(in[off]));
        }

        public void fromExternal(double[] ext, double[] in, int off) {
            in[off] = atanh(ext[ECCENTRICITY]);
        }

        public double step(int k) {
            return 1e-5;
        }

        public List<String> names() {
            return List.of("artanh eccentricity");
        }
    }

    private String label(int index) {
        return nameBands[index] == null || bands.size() < 2 ? names[index] : names[index] + "@" + nameBands[index];
    }

    private static double atanh(double x) {
        return 0.5 * Math.log((1 + x) / (1 - x));
    }
}

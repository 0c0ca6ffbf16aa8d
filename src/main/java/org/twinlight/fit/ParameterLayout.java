package org.twinlight.fit;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.twinlight.BadInputException;
import org.twinlight.eclipse.BandValues;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.eclipse.ProximityEffects;

/**
 * The model's parameters, one {@link FitParameter} each (the common ones, then each band's), and
 * the map between their values in the contract's units ("external") and the solver's unbounded
 * internal coordinates. Edges that real stars sit on are ordinary points of the internal
 * coordinates, so the solver neither stalls nor divides by zero there:
 * <ul>
 * <li>both radii free: ln(r₁+r₂) and ln(r₂/r₁) (sum and ratio are far less correlated than
 * r₁ and r₂ for a detached pair); one radius: ln r</li>
 * <li>inclination: y = cos i, allowed through zero and folded, i = arccos |y| (the flux depends on
 * cos² i only), so i = 90° is an ordinary point</li>
 * <li>eccentricity and ω: (e cos ω, e sin ω), so e = 0 is an ordinary point; eccentricity alone and
 * third light: folded, value = |x|</li>
 * <li>surface-brightness ratio: ln J</li>
 * <li>period, epoch, ω alone and limb-darkening coefficients: (value − start) / scale</li>
 * <li>proximity effects (present only when the starting model switches them on, after the
 * bands' parameters): mass ratio ln q; albedos folded at 0 and held at most 1; gravity-darkening
 * and beaming factors and the free amplitudes (value − start) / scale</li>
 * </ul>
 * Finite-difference steps are one hundredth of each parameter's scale, carried into the internal
 * coordinate. Points the solver proposes outside the model's domain are moved back inside by
 * {@link #validate(double[])} (Commons Math's parameter validator), never given a sentinel residual.
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
    /** Every name a proximity effect can bring into the layout. */
    private static final Set<String> PROXIMITY_NAMES = Set.of("massRatio", "ellipsoidal.amplitude",
            "ellipsoidal.gravityDarkening1", "ellipsoidal.gravityDarkening2", "reflection.albedo1", "reflection.albedo2",
            "beaming.amplitude", "beaming.factor1", "beaming.factor2");
    /** Finite-difference step as a fraction of a parameter's scale (common practice, no source). */
    static final double STEP_FRACTION = 0.01;
    /** The largest eccentricity and third light a trial point may take. */
    private static final double MAX_ECCENTRICITY = 0.95;
    private static final double MAX_THIRD_LIGHT = 0.98;
    /** Trial radii keep the spheres this far apart at periastron (fraction of 1 − e). */
    private static final double MAX_SUM_FRACTION = 0.98;

    private final ModelFile start;
    private final List<String> bands;
    private final int[] bandOffset;
    private final BinaryParameters[] bandStart;
    private final List<FitParameter> parameters;
    private final List<Block> blocks = new ArrayList<>();
    /** Index of the first proximity parameter; the names of those parameters in order. */
    private final int proximityOffset;
    private final List<String> proximityNames;
    private final int internalSize;
    /** The velocities of a joint fit, or null. */
    private final JointVelocities velocities;
    /** Index of k1 in the external vector (the velocity parameters come last), or −1. */
    private final int velocityBase;

    ParameterLayout(ModelFile start, List<String> bands, Set<String> freeNames) {
        this(start, bands, freeNames, -1, null);
    }

    /** The layout of a joint fit: the velocity parameters (k1, k2, γ, offsets) follow the bands' ones. */
    ParameterLayout(ModelFile start, List<String> bands, Set<String> freeNames, JointVelocities velocities) {
        this(start, bands, freeNames, -1, velocities);
    }

    /**
     * The layout of a profile: the parameter at {@code fixedIndex} held at its value in {@code start}
     * while the other free parameters move.
     */
    ParameterLayout(ModelFile start, List<String> bands, Set<String> freeNames, int fixedIndex,
            JointVelocities velocities) {
        this.start = start;
        this.velocities = velocities;
        this.bands = List.copyOf(bands);
        this.bandOffset = new int[bands.size()];
        this.bandStart = new BinaryParameters[bands.size()];
        List<FitParameter> list = new ArrayList<>();
        BinaryParameters c = start.common();
        double p = c.periodDays();
        list.add(param("period", null, p, 1e-5 * p, 0, Double.POSITIVE_INFINITY, FitParameter.Edge.NONE));
        list.add(param("epoch", null, c.epochDays(), 2e-4 * p, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY,
                FitParameter.Edge.NONE));
        list.add(param("radius1", null, c.radius1(), 1e-3, 0, 1, FitParameter.Edge.NONE));
        list.add(param("radius2", null, c.radius2(), 1e-3, 0, 1, FitParameter.Edge.NONE));
        list.add(param("inclination", null, c.inclinationDeg(), 0.1, 0, 90, FitParameter.Edge.UPPER));
        list.add(param("eccentricity", null, c.eccentricity(), 1e-3, 0, 1, FitParameter.Edge.LOWER));
        list.add(param("omega", null, c.omegaDeg(), 0.1, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY,
                FitParameter.Edge.NONE));
        for (int b = 0; b < bands.size(); b++) {
            String band = bands.get(b);
            bandStart[b] = start.forBand(band);
            bandOffset[b] = list.size();
            BinaryParameters bp = bandStart[b];
            list.add(param("surfaceBrightnessRatio", band, bp.surfaceBrightnessRatio(),
                    Math.max(1e-3, 0.01 * bp.surfaceBrightnessRatio()), 0, Double.POSITIVE_INFINITY,
                    FitParameter.Edge.NONE));
            list.add(param("thirdLight", band, bp.thirdLight(), 0.01, 0, 1, FitParameter.Edge.LOWER));
            addCoefficients(list, "limbDarkening1", band, bp.limbDarkening1());
            addCoefficients(list, "limbDarkening2", band, bp.limbDarkening2());
        }
        this.proximityOffset = list.size();
        addProximity(list, c.proximity());
        this.proximityNames = list.subList(proximityOffset, list.size()).stream().map(FitParameter::name).toList();
        Set<String> lightCurveNames = new LinkedHashSet<>(freeNames);
        if (velocities != null) {
            // the velocity parameters are always free in a joint fit: naming them changes nothing
            lightCurveNames.removeIf(n -> JointVelocities.MAIN_NAMES.contains(n) || n.startsWith("offset."));
        }
        List<FitParameter> marked = new ArrayList<>(markFree(list, lightCurveNames));
        this.velocityBase = velocities == null ? -1 : marked.size();
        if (velocities != null) {
            marked.addAll(velocities.parameters());
        }
        if (fixedIndex >= 0) {
            marked.set(fixedIndex, marked.get(fixedIndex).withFree(false));
        }
        this.parameters = List.copyOf(marked);
        buildBlocks();
        internalSize = blocks.stream().mapToInt(Block::size).sum();
    }

    private static FitParameter param(String name, String band, double value, double scale, double lo, double hi,
            FitParameter.Edge edge) {
        return new FitParameter(name, band, value, scale, lo, hi, edge, false);
    }

    private static void addCoefficients(List<FitParameter> list, String star, String band, LimbDarkening ld) {
        List<String> names = List.of(ld.law().coefficientNames());
        double[] values = ld.coefficients();
        for (int k = 0; k < names.size(); k++) {
            list.add(param(star + "." + names.get(k), band, values[k], 0.01, Double.NEGATIVE_INFINITY,
                    Double.POSITIVE_INFINITY, FitParameter.Edge.NONE));
        }
    }

    /**
     * The parameters of the proximity effects the model switches on: the mass ratio when given,
     * the ellipsoidal variation's gravity-darkening coefficients or free amplitude, the albedos,
     * the beaming factors or free amplitude. Scales: about what a good light curve determines
     * (common practice, no source).
     */
    private static void addProximity(List<FitParameter> list, ProximityEffects x) {
        double inf = Double.POSITIVE_INFINITY;
        if (x.massRatio() != null) {
            list.add(param("massRatio", null, x.massRatio(), 0.01, 0, inf, FitParameter.Edge.NONE));
        }
        ProximityEffects.Ellipsoidal e = x.ellipsoidal();
        if (e != null && e.freeAmplitude()) {
            list.add(param("ellipsoidal.amplitude", null, e.amplitude(), 1e-4, -inf, inf, FitParameter.Edge.NONE));
        } else if (e != null) {
            list.add(param("ellipsoidal.gravityDarkening1", null, e.gravityDarkening1(), 0.05, -inf, inf,
                    FitParameter.Edge.NONE));
            list.add(param("ellipsoidal.gravityDarkening2", null, e.gravityDarkening2(), 0.05, -inf, inf,
                    FitParameter.Edge.NONE));
        }
        if (x.reflection() != null) {
            list.add(param("reflection.albedo1", null, x.reflection().albedo1(), 0.02, 0, 1, FitParameter.Edge.LOWER));
            list.add(param("reflection.albedo2", null, x.reflection().albedo2(), 0.02, 0, 1, FitParameter.Edge.LOWER));
        }
        ProximityEffects.Beaming b = x.beaming();
        if (b != null && b.freeAmplitude()) {
            list.add(param("beaming.amplitude", null, b.amplitude(), 1e-5, -inf, inf, FitParameter.Edge.NONE));
        } else if (b != null) {
            list.add(param("beaming.factor1", null, b.factor1(), 0.05, -inf, inf, FitParameter.Edge.NONE));
            list.add(param("beaming.factor2", null, b.factor2(), 0.05, -inf, inf, FitParameter.Edge.NONE));
        }
    }

    private static List<FitParameter> markFree(List<FitParameter> list, Set<String> freeNames) {
        Set<String> known = new LinkedHashSet<>();
        for (int i = 0; i < COMMON_COUNT; i++) {
            known.add(list.get(i).name());
        }
        known.addAll(List.of("surfaceBrightnessRatio", "thirdLight", "limbDarkening1", "limbDarkening2"));
        list.stream().map(FitParameter::name).filter(n -> n.equals("massRatio") || n.startsWith("ellipsoidal.")
                || n.startsWith("reflection.") || n.startsWith("beaming.")).forEach(known::add);
        List<FitParameter> out = new ArrayList<>(list);
        for (String f : freeNames) {
            boolean matched = false;
            for (int i = 0; i < out.size(); i++) {
                String n = out.get(i).name();
                if (n.equals(f) || (f.equals("limbDarkening1") || f.equals("limbDarkening2")) && n.startsWith(f + ".")) {
                    out.set(i, out.get(i).withFree(true));
                    matched = true;
                }
            }
            if (!matched && PROXIMITY_NAMES.contains(f)) {
                throw new BadInputException("option --free: '" + f + "' is not a parameter of this model: switch its "
                        + "effect on in the model file (massRatio, ellipsoidal, reflection, beaming; docs/model.md)");
            }
            if (!matched) {
                boolean ldName = f.startsWith("limbDarkening1.") || f.startsWith("limbDarkening2.");
                throw new BadInputException("option --free: unknown parameter '" + f + "'; "
                        + (ldName ? "the limb-darkening law of that star has coefficients "
                                + coefficientList(out, f.substring(0, 14)) + " (or the law takes none)"
                                : "expected names from " + String.join(", ", known)
                                        + ", or limbDarkening1.NAME / limbDarkening2.NAME for one coefficient"));
            }
        }
        return List.copyOf(out);
    }

    private static String coefficientList(List<FitParameter> list, String star) {
        LinkedHashSet<String> s = new LinkedHashSet<>();
        for (FitParameter p : list) {
            if (p.name().startsWith(star + ".")) {
                s.add(p.name());
            }
        }
        return s.isEmpty() ? "none" : String.join(", ", s);
    }

    private void buildBlocks() {
        addScaled(PERIOD);
        addScaled(EPOCH);
        boolean r1 = isFree(RADIUS1);
        boolean r2 = isFree(RADIUS2);
        if (r1 && r2) {
            blocks.add(new RadiusPair());
        } else if (r1 || r2) {
            blocks.add(new Logarithm(r1 ? RADIUS1 : RADIUS2));
        }
        if (isFree(INCLINATION)) {
            blocks.add(new CosInclination());
        }
        if (isFree(ECCENTRICITY) && isFree(OMEGA)) {
            blocks.add(new EccentricityVector());
        } else if (isFree(ECCENTRICITY)) {
            blocks.add(new Folded(ECCENTRICITY));
        } else {
            addScaled(OMEGA);
        }
        if (velocities != null) {
            for (int i = velocityBase; i < parameters.size(); i++) {
                addScaled(i);
            }
        }
        for (int b = 0; b < bands.size(); b++) {
            int off = bandOffset[b];
            if (isFree(off)) {
                blocks.add(new Logarithm(off));
            }
            if (isFree(off + 1)) {
                blocks.add(new Folded(off + 1));
            }
            int nLd = bandStart[b].limbDarkening1().coefficientCount() + bandStart[b].limbDarkening2().coefficientCount();
            for (int k = 0; k < nLd; k++) {
                addScaled(off + 2 + k);
            }
        }
        for (int i = proximityOffset; i < proximityOffset + proximityNames.size(); i++) {
            String name = parameters.get(i).name();
            if (!isFree(i)) {
                continue;
            }
            if (name.equals("massRatio")) {
                blocks.add(new Logarithm(i));
            } else if (name.startsWith("reflection.")) {
                blocks.add(new Folded(i));
            } else {
                blocks.add(new Scaled(i));
            }
        }
    }

    private void addScaled(int index) {
        if (isFree(index)) {
            blocks.add(new Scaled(index));
        }
    }

    List<String> bands() {
        return bands;
    }

    /** Every parameter, common ones first, in the order of the external vector. */
    List<FitParameter> parameters() {
        return parameters;
    }

    int externalSize() {
        return parameters.size();
    }

    int internalSize() {
        return internalSize;
    }

    FitParameter parameter(int i) {
        return parameters.get(i);
    }

    boolean isFree(int i) {
        return parameters.get(i).free();
    }

    /** Index of a parameter by name and band (band ignored for common parameters), −1 if absent. */
    int indexOf(String name, String band) {
        for (int i = 0; i < parameters.size(); i++) {
            FitParameter p = parameters.get(i);
            if (p.name().equals(name) && (p.band() == null || band == null || p.band().equals(band))) {
                return i;
            }
        }
        return -1;
    }

    /**
     * The same parameters started from the external vector {@code ext}, with the one at
     * {@code index} fixed there.
     */
    ParameterLayout fixing(int index, double[] ext) {
        Set<String> names = new LinkedHashSet<>();
        int end = velocities == null ? parameters.size() : velocityBase;
        for (int i = 0; i < end; i++) {
            if (parameters.get(i).free()) {
                names.add(parameters.get(i).name());
            }
        }
        JointVelocities v = velocities == null ? null
                : velocities.startingAt(Arrays.copyOfRange(ext, velocityBase, parameters.size()));
        return new ParameterLayout(modelFile(ext), bands, names, index, v);
    }

    /** The velocities of a joint fit, or null. */
    JointVelocities velocities() {
        return velocities;
    }

    /** Index of k1 in the external vector, −1 without velocities. */
    int velocityBase() {
        return velocityBase;
    }

    /** The same parameters, free and fixed alike, started from the external vector {@code ext}. */
    ParameterLayout startingAt(double[] ext) {
        return fixing(-1, ext);
    }

    /** The starting model as an external vector. */
    double[] startExternal() {
        return parameters.stream().mapToDouble(FitParameter::value).toArray();
    }

    /**
     * The internal starting vector. A folded coordinate that starts exactly on its fold (ℓ₃ = 0,
     * i = 90°) starts one scale away from it instead: on the fold its central derivative vanishes
     * and the solver could not move it.
     */
    double[] startInternal() {
        double[] in = toInternal(startExternal());
        int off = 0;
        for (Block blk : blocks) {
            if ((blk instanceof Folded || blk instanceof CosInclination) && in[off] == 0) {
                in[off] = blk.step(0) / STEP_FRACTION;
            }
            off += blk.size();
        }
        return in;
    }

    double[] toInternal(double[] ext) {
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

    /**
     * The parameter validator: an internal point whose model lies outside the domain (e ≥ 0.95,
     * ℓ₃ ≥ 0.98, spheres touching at periastron) is moved to the nearest edge of a slightly smaller
     * domain; points inside are returned unchanged.
     */
    double[] validate(double[] internal) {
        double[] ext = toExternal(internal);
        boolean changed = false;
        if (ext[ECCENTRICITY] > MAX_ECCENTRICITY) {
            ext[ECCENTRICITY] = MAX_ECCENTRICITY;
            changed = true;
        }
        double maxSum = MAX_SUM_FRACTION * (1 - ext[ECCENTRICITY]);
        double sum = ext[RADIUS1] + ext[RADIUS2];
        if (sum > maxSum) {
            ext[RADIUS1] *= maxSum / sum;
            ext[RADIUS2] *= maxSum / sum;
            changed = true;
        }
        for (int off : bandOffset) {
            if (ext[off + 1] > MAX_THIRD_LIGHT) {
                ext[off + 1] = MAX_THIRD_LIGHT;
                changed = true;
            }
        }
        for (int i = proximityOffset; i < proximityOffset + proximityNames.size(); i++) {
            if (parameters.get(i).name().startsWith("reflection.") && ext[i] > 1) {
                ext[i] = 1;
                changed = true;
            }
        }
        return changed ? toInternal(ext) : internal;
    }

    /**
     * Whether an external vector lies in the domain the validator keeps trial points in: every
     * free parameter within its bounds (radii and the surface-brightness ratio above 0), e and ℓ₃
     * below their limits, the spheres apart at periastron.
     */
    boolean inDomain(double[] ext) {
        for (int i = 0; i < parameters.size(); i++) {
            FitParameter p = parameters.get(i);
            if (p.free() && !(ext[i] >= p.lower() && ext[i] <= p.upper())) {
                return false;
            }
        }
        if (!(ext[RADIUS1] > 0 && ext[RADIUS2] > 0 && ext[ECCENTRICITY] <= MAX_ECCENTRICITY
                && ext[RADIUS1] + ext[RADIUS2] <= MAX_SUM_FRACTION * (1 - ext[ECCENTRICITY]))) {
            return false;
        }
        for (int off : bandOffset) {
            if (!(ext[off] > 0 && ext[off + 1] <= MAX_THIRD_LIGHT)) {
                return false;
            }
        }
        return true;
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

    /** For each internal coordinate, the external parameters it moves (labels). */
    List<String> internalOwners() {
        List<String> out = new ArrayList<>();
        for (Block blk : blocks) {
            out.addAll(blk.owners());
        }
        return out;
    }

    /**
     * The internal coordinate that a folded one-coordinate block gives the parameter at
     * {@code index} (cos i, |ℓ₃|, |e|), else −1. At the fold its derivative vanishes, so a
     * parameter reported as a limit leaves it out of the covariance.
     */
    int foldedCoordinate(int index) {
        int off = 0;
        for (Block blk : blocks) {
            if (blk instanceof CosInclination && index == INCLINATION
                    || blk instanceof Folded f && f.index == index) {
                return off;
            }
            off += blk.size();
        }
        return -1;
    }

    /** Model parameters of band b for an external vector. */
    BinaryParameters parameters(double[] ext, int b) {
        BinaryParameters c = start.common();
        BinaryParameters p = new BinaryParameters(ext[PERIOD], ext[EPOCH], ext[RADIUS1], ext[RADIUS2],
                ext[INCLINATION], ext[ECCENTRICITY], ext[OMEGA], c.surfaceBrightnessRatio(), c.thirdLight(),
                c.limbDarkening1(), c.limbDarkening2(), c.exposureTimeDays(), c.supersample(), proximity(ext));
        return bandValues(ext, b).applyTo(p);
    }

    /** The proximity effects of the starting model with the values of an external vector put in. */
    ProximityEffects proximity(double[] ext) {
        ProximityEffects x = start.common().proximity();
        if (proximityNames.isEmpty()) {
            return x;
        }
        ProximityEffects.Ellipsoidal e = x.ellipsoidal();
        if (e != null) {
            e = e.freeAmplitude() ? ProximityEffects.Ellipsoidal.free(value(ext, "ellipsoidal.amplitude"))
                    : ProximityEffects.Ellipsoidal.fromPhysics(value(ext, "ellipsoidal.gravityDarkening1"),
                            value(ext, "ellipsoidal.gravityDarkening2"));
        }
        ProximityEffects.Reflection r = x.reflection() == null ? null : new ProximityEffects.Reflection(
                value(ext, "reflection.albedo1"), value(ext, "reflection.albedo2"));
        ProximityEffects.Beaming b = x.beaming();
        if (b != null) {
            b = b.freeAmplitude() ? ProximityEffects.Beaming.free(value(ext, "beaming.amplitude"))
                    : ProximityEffects.Beaming.fromVelocities(value(ext, "beaming.factor1"),
                            value(ext, "beaming.factor2"));
        }
        return x.withMassRatio(x.massRatio() == null ? null : value(ext, "massRatio")).withTerms(e, r, b);
    }

    private double value(double[] ext, String proximityName) {
        return ext[proximityOffset + proximityNames.indexOf(proximityName)];
    }

    BandValues bandValues(double[] ext, int b) {
        int off = bandOffset[b];
        LimbDarkening ld1 = bandStart[b].limbDarkening1();
        LimbDarkening ld2 = bandStart[b].limbDarkening2();
        double[] c1 = Arrays.copyOfRange(ext, off + 2, off + 2 + ld1.coefficientCount());
        double[] c2 = Arrays.copyOfRange(ext, off + 2 + c1.length, off + 2 + c1.length + ld2.coefficientCount());
        return new BandValues(ext[off], ext[off + 1], ld1.withCoefficients(c1), ld2.withCoefficients(c2));
    }

    /** The model file for an external vector (same layout as the starting model). */
    ModelFile modelFile(double[] ext) {
        BinaryParameters common = parameters(ext, 0);
        if (bands.size() == 1 && start.bands().isEmpty()) {
            return ModelFile.of(common);
        }
        Map<String, BandValues> out = new LinkedHashMap<>(start.bands());
        for (int b = 0; b < bands.size(); b++) {
            out.put(bands.get(b), bandValues(ext, b));
        }
        BinaryParameters c = start.common();
        BinaryParameters geometry = new BinaryParameters(common.periodDays(), common.epochDays(), common.radius1(),
                common.radius2(), common.inclinationDeg(), common.eccentricity(), common.omegaDeg(),
                c.surfaceBrightnessRatio(), c.thirdLight(), c.limbDarkening1(), c.limbDarkening2(),
                common.exposureTimeDays(), common.supersample(), common.proximity());
        return new ModelFile(geometry, out, start.commonComplete());
    }

    /** One or more internal coordinates standing for one or more external parameters. */
    private interface Block {
        int size();

        void toExternal(double[] in, int off, double[] ext);

        void fromExternal(double[] ext, double[] in, int off);

        double step(int k);

        List<String> names();

        List<String> owners();
    }

    private String label(int index) {
        return parameters.get(index).label(bands.size() > 1);
    }

    private double scale(int index) {
        return parameters.get(index).scale();
    }

    /** (value − start) / scale. */
    private final class Scaled implements Block {
        private final int index;
        private final double origin;
        private final double scale;

        Scaled(int index) {
            this.index = index;
            this.origin = parameters.get(index).value();
            this.scale = scale(index);
        }

        public int size() {
            return 1;
        }

        public void toExternal(double[] in, int off, double[] ext) {
            ext[index] = origin + in[off] * scale;
        }

        public void fromExternal(double[] ext, double[] in, int off) {
            in[off] = (ext[index] - origin) / scale;
        }

        public double step(int k) {
            return STEP_FRACTION;
        }

        public List<String> names() {
            return List.of("(" + label(index) + " − start)/scale");
        }

        public List<String> owners() {
            return List.of(label(index));
        }
    }

    /** ln value. */
    private final class Logarithm implements Block {
        private final int index;
        private final double step;

        Logarithm(int index) {
            this.index = index;
            this.step = STEP_FRACTION * scale(index) / Math.max(parameters.get(index).value(), scale(index));
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
            return step;
        }

        public List<String> names() {
            return List.of("ln " + label(index));
        }

        public List<String> owners() {
            return List.of(label(index));
        }
    }

    /** value = |x|: the lower bound 0 is an ordinary point. */
    private final class Folded implements Block {
        private final int index;

        Folded(int index) {
            this.index = index;
        }

        public int size() {
            return 1;
        }

        public void toExternal(double[] in, int off, double[] ext) {
            ext[index] = Math.abs(in[off]);
        }

        public void fromExternal(double[] ext, double[] in, int off) {
            in[off] = ext[index];
        }

        public double step(int k) {
            return STEP_FRACTION * scale(index);
        }

        public List<String> names() {
            return List.of(label(index) + " (folded at 0)");
        }

        public List<String> owners() {
            return List.of(label(index));
        }
    }

    private final class RadiusPair implements Block {
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
            double r1 = parameters.get(RADIUS1).value();
            double r2 = parameters.get(RADIUS2).value();
            return k == 0 ? STEP_FRACTION * scale(RADIUS1) / (r1 + r2)
                    : STEP_FRACTION * scale(RADIUS1) / Math.min(r1, r2);
        }

        public List<String> names() {
            return List.of("ln sumOfRadii", "ln radiusRatio");
        }

        public List<String> owners() {
            return List.of("radius1, radius2", "radius1, radius2");
        }
    }

    private final class CosInclination implements Block {
        public int size() {
            return 1;
        }

        public void toExternal(double[] in, int off, double[] ext) {
            ext[INCLINATION] = Math.toDegrees(Math.acos(Math.min(1.0, Math.abs(in[off]))));
        }

        public void fromExternal(double[] ext, double[] in, int off) {
            in[off] = Math.cos(Math.toRadians(ext[INCLINATION]));
        }

        public double step(int k) {
            double sinI = Math.sin(Math.toRadians(parameters.get(INCLINATION).value()));
            return STEP_FRACTION * Math.toRadians(scale(INCLINATION)) * Math.max(sinI, 0.1);
        }

        public List<String> names() {
            return List.of("cos inclination (folded at 0)");
        }

        public List<String> owners() {
            return List.of("inclination");
        }
    }

    private final class EccentricityVector implements Block {
        public int size() {
            return 2;
        }

        public void toExternal(double[] in, int off, double[] ext) {
            double x = in[off];
            double y = in[off + 1];
            ext[ECCENTRICITY] = Math.hypot(x, y);
            if (x != 0 || y != 0) {
                ext[OMEGA] = Math.toDegrees(Math.atan2(y, x));
            }
        }

        public void fromExternal(double[] ext, double[] in, int off) {
            double w = Math.toRadians(ext[OMEGA]);
            in[off] = ext[ECCENTRICITY] * Math.cos(w);
            in[off + 1] = ext[ECCENTRICITY] * Math.sin(w);
        }

        public double step(int k) {
            return STEP_FRACTION * scale(ECCENTRICITY);
        }

        public List<String> names() {
            return List.of("e cos omega", "e sin omega");
        }

        public List<String> owners() {
            return List.of("eccentricity, omega", "eccentricity, omega");
        }
    }
}

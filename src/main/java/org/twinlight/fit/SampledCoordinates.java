package org.twinlight.fit;

import java.util.ArrayList;
import java.util.List;
import org.twinlight.eclipse.LimbDarkeningLaw;

/**
 * The coordinates the sampler moves in, and their map to the fit's external parameters. Uniform in
 * these coordinates is the default prior:
 * <ul>
 * <li>eccentricity and ω both free: (√e cos ω, √e sin ω) inside the unit disk, which is uniform in
 * e and in ω (the Jacobian of (e, ω) → (√e cos ω, √e sin ω) is constant, 1/2 with ω in radians);
 * e alone: e itself</li>
 * <li>both quadratic limb-darkening coefficients of a star free: q₁ = (u₁ + u₂)², q₂ = u₁ / (2(u₁ +
 * u₂)) in [0, 1]², uniform over the physically allowed (u₁, u₂) (Kipping 2013, MNRAS 435, 2152,
 * eqs. 15–18)</li>
 * <li>every other free parameter: its offset from the least-squares value, uniform between the
 * parameter's bounds (ω alone: within ±180° of the least-squares value)</li>
 * </ul>
 */
final class SampledCoordinates {
    private final ParameterLayout layout;
    private final double[] reference;
    private final List<Block> blocks = new ArrayList<>();
    private final int size;

    SampledCoordinates(ParameterLayout layout, double[] reference) {
        this.layout = layout;
        this.reference = reference.clone();
        boolean eccentricityVector = layout.isFree(ParameterLayout.ECCENTRICITY) && layout.isFree(ParameterLayout.OMEGA);
        List<Integer> paired = new ArrayList<>();
        if (eccentricityVector) {
            blocks.add(new EccentricityVector());
            paired.add(ParameterLayout.ECCENTRICITY);
            paired.add(ParameterLayout.OMEGA);
        }
        for (int b = 0; b < layout.bands().size(); b++) {
            for (int star = 1; star <= 2; star++) {
                String band = layout.bands().get(b);
                int ia = layout.indexOf("limbDarkening" + star + ".a", band);
                int ib = layout.indexOf("limbDarkening" + star + ".b", band);
                LimbDarkeningLaw law = star == 1 ? layout.parameters(reference, b).limbDarkening1().law()
                        : layout.parameters(reference, b).limbDarkening2().law();
                if (law == LimbDarkeningLaw.QUADRATIC && ia >= 0 && ib >= 0 && layout.isFree(ia) && layout.isFree(ib)) {
                    blocks.add(new KippingQuadratic(ia, ib));
                    paired.add(ia);
                    paired.add(ib);
                }
            }
        }
        for (int i = 0; i < layout.externalSize(); i++) {
            if (layout.isFree(i) && !paired.contains(i)) {
                blocks.add(new Offset(i));
            }
        }
        size = blocks.stream().mapToInt(Block::size).sum();
    }

    int size() {
        return size;
    }

    /** The names of the sampled coordinates, in order (a parameter's name where it is sampled as itself). */
    List<String> names() {
        List<String> out = new ArrayList<>();
        blocks.forEach(b -> out.addAll(b.names()));
        return out;
    }

    /** The external vector of sampled coordinates u, into {@code ext} (fixed parameters at their values). */
    void toExternal(double[] u, double[] ext) {
        System.arraycopy(reference, 0, ext, 0, reference.length);
        int off = 0;
        for (Block b : blocks) {
            b.toExternal(u, off, ext);
            off += b.size();
        }
    }

    double[] toExternal(double[] u) {
        double[] ext = new double[reference.length];
        toExternal(u, ext);
        return ext;
    }

    double[] toSampled(double[] ext) {
        double[] u = new double[size];
        int off = 0;
        for (Block b : blocks) {
            b.toSampled(ext, u, off);
            off += b.size();
        }
        return u;
    }

    /**
     * The first sampled coordinate outside its allowed range, named with its parameters, or null
     * when u is inside every range.
     */
    String outside(double[] u) {
        int off = 0;
        for (Block b : blocks) {
            if (!b.inside(u, off)) {
                return b.describe();
            }
            off += b.size();
        }
        return null;
    }

    /** One or two sampled coordinates standing for one or two external parameters. */
    private interface Block {
        int size();

        void toExternal(double[] u, int off, double[] ext);

        void toSampled(double[] ext, double[] u, int off);

        boolean inside(double[] u, int off);

        String describe();

        /** The names of its coordinates, in order. */
        List<String> names();
    }

    private String label(int i) {
        return layout.parameter(i).label(layout.bands().size() > 1);
    }

    /** Offset from the least-squares value, inside the parameter's bounds. */
    private final class Offset implements Block {
        private final int index;
        private final double lower;
        private final double upper;

        Offset(int index) {
            this.index = index;
            FitParameter p = layout.parameter(index);
            if (index == ParameterLayout.OMEGA) {
                lower = reference[index] - 180;
                upper = reference[index] + 180;
            } else {
                lower = p.lower();
                upper = p.upper();
            }
        }

        public int size() {
            return 1;
        }

        public void toExternal(double[] u, int off, double[] ext) {
            ext[index] = reference[index] + u[off];
        }

        public void toSampled(double[] ext, double[] u, int off) {
            u[off] = ext[index] - reference[index];
        }

        public boolean inside(double[] u, int off) {
            double v = reference[index] + u[off];
            // a reachable edge (e = 0, ℓ₃ = 0, i = 90°) is allowed; the others (r = 0, P = 0) are not
            FitParameter p = layout.parameter(index);
            boolean lowOk = p.edge() == FitParameter.Edge.LOWER ? v >= lower : v > lower;
            boolean highOk = p.edge() == FitParameter.Edge.UPPER ? v <= upper : v < upper;
            return lowOk && highOk;
        }

        public String describe() {
            return label(index) + " outside [" + lower + ", " + upper + "]";
        }

        @Override
        public List<String> names() {
            return List.of(label(index));
        }
    }

    /** (√e cos ω, √e sin ω), ω kept within ±180° of its least-squares value. */
    private final class EccentricityVector implements Block {
        public int size() {
            return 2;
        }

        public void toExternal(double[] u, int off, double[] ext) {
            double c = u[off];
            double s = u[off + 1];
            ext[ParameterLayout.ECCENTRICITY] = c * c + s * s;
            double w = Math.toDegrees(Math.atan2(s, c));
            double ref = reference[ParameterLayout.OMEGA];
            ext[ParameterLayout.OMEGA] = ref + Math.IEEEremainder(w - ref, 360);
        }

        public void toSampled(double[] ext, double[] u, int off) {
            double r = Math.sqrt(Math.max(0, ext[ParameterLayout.ECCENTRICITY]));
            double w = Math.toRadians(ext[ParameterLayout.OMEGA]);
            u[off] = r * Math.cos(w);
            u[off + 1] = r * Math.sin(w);
        }

        public boolean inside(double[] u, int off) {
            return u[off] * u[off] + u[off + 1] * u[off + 1] < 1;
        }

        public String describe() {
            return "eccentricity outside [0, 1)";
        }

        @Override
        public List<String> names() {
            return List.of("√e cos ω", "√e sin ω");
        }
    }

    /** Kipping's (2013) q₁, q₂ of a quadratic law. */
    private final class KippingQuadratic implements Block {
        private final int a;
        private final int b;

        KippingQuadratic(int a, int b) {
            this.a = a;
            this.b = b;
        }

        public int size() {
            return 2;
        }

        public void toExternal(double[] u, int off, double[] ext) {
            // Kipping 2013, eqs. 15 and 16: u₁ = 2√q₁ q₂, u₂ = √q₁ (1 − 2 q₂)
            double sq = Math.sqrt(Math.max(0, u[off]));
            ext[a] = 2 * sq * u[off + 1];
            ext[b] = sq * (1 - 2 * u[off + 1]);
        }

        public void toSampled(double[] ext, double[] u, int off) {
            // Kipping 2013, eqs. 17 and 18
            double sum = ext[a] + ext[b];
            u[off] = sum * sum;
            u[off + 1] = sum == 0 ? 0.5 : ext[a] / (2 * sum);
        }

        public boolean inside(double[] u, int off) {
            return u[off] >= 0 && u[off] <= 1 && u[off + 1] >= 0 && u[off + 1] <= 1;
        }

        public String describe() {
            return label(a) + " and " + label(b) + " outside the physically allowed region of the quadratic law "
                    + "(q1 = (a + b)² and q2 = a / (2(a + b)) in [0, 1]: Kipping 2013, MNRAS 435, 2152)";
        }

        @Override
        public List<String> names() {
            return List.of("q1 of " + label(a) + ", " + label(b), "q2 of " + label(a) + ", " + label(b));
        }
    }
}

package org.twinlight.eclipse;

/**
 * The hidden fraction h(z) of {@link Occultation#hiddenFraction} for one star and one radius
 * ratio p, tabulated against the separation z over the range a model evaluation needs and
 * interpolated: for a light curve with many points in eclipse it replaces one exact occultation
 * per point by a few hundred per evaluation.
 *
 * <p>h is smooth in z except at the contacts z = |1 − p| and z = 1 + p, where it behaves like
 * powers of the distance δ from the contact with exponents in quarters (δ^{3/2} for the uniform
 * disc, δ^{7/4} … for the limb-darkened ones, since the intensity near the limb is a function of
 * √μ ∝ δ^{1/4}). The range 0 … 1 + p is therefore cut into three pieces at the contacts and at
 * the middle of the partial phase (z = 1 for p &lt; 1, z = p otherwise), and each piece is
 * tabulated at {@link #STEPS} steps uniform in s = δ^{1/4}, δ measured from the piece's contact,
 * in which those powers are polynomials; the nodes crowd where h turns fastest. Between nodes h
 * is the Lagrange polynomial of degree {@link #DEGREE} through the nearest eight nodes (Abramowitz
 * &amp; Stegun 1964, 25.2.2, Lagrange's interpolation formula; from memory), expanded once per
 * step in powers of the position within the step and evaluated by Horner's rule. Only the part of each piece between the smallest and the largest z
 * asked for is tabulated, so the steps are as fine as the data allow. Under full cover (z ≤ p − 1)
 * and beyond the outer contact the value is exact (1 and 0).
 *
 * <p>Accuracy: within 1e-9 of the exact hidden fraction for every law tested
 * (OccultationTableTest), far below 1 ppm of the flux. Immutable and thread-safe.
 */
final class OccultationTable {
    /** Steps per piece. */
    static final int STEPS = 64;
    /** Degree of the interpolating polynomial. */
    static final int DEGREE = 7;
    /**
     * With fewer points in eclipse than this the exact evaluation is cheaper than building a
     * table (which costs up to 3 × 65 exact values).
     */
    static final int MIN_POINTS = 64;
    private static final int NODES = DEGREE + 1;
    /**
     * POWER[off][m · NODES + j]: the coefficient of v^m in the Lagrange basis polynomial of node j
     * of a stencil of eight nodes at v = j − off, so that on the step whose left node is the
     * stencil's node {@code off} the interpolant is Σ_m v^m Σ_j POWER[off][m·8 + j] f_j, 0 ≤ v ≤ 1.
     */
    private static final double[][] POWER = new double[NODES][NODES * NODES];

    static {
        for (int off = 0; off < NODES; off++) {
            for (int j = 0; j < NODES; j++) {
                // Π_{m≠j} (v − (m − off)) / (j − m), expanded in powers of v
                double[] poly = {1};
                for (int m = 0; m < NODES; m++) {
                    if (m == j) {
                        continue;
                    }
                    double root = m - off;
                    double scale = 1.0 / (j - m);
                    double[] next = new double[poly.length + 1];
                    for (int q = 0; q < poly.length; q++) {
                        next[q + 1] += poly[q] * scale;
                        next[q] -= poly[q] * root * scale;
                    }
                    poly = next;
                }
                for (int m = 0; m < NODES; m++) {
                    POWER[off][m * NODES + j] = poly[m];
                }
            }
        }
    }

    private final LimbDarkening ld;
    private final double p;
    private final double inner;
    private final double middle;
    private final double outer;
    /** The pieces below |1 − p| (only for p &lt; 1), from there to the middle, and beyond; null where not needed. */
    private final Piece below;
    private final Piece rising;
    private final Piece falling;

    /**
     * A table for separations between {@code zMin} and {@code zMax} (0 ≤ zMin ≤ zMax); p &gt; 0 finite.
     */
    OccultationTable(LimbDarkening ld, double p, double zMin, double zMax) {
        this.ld = ld;
        this.p = p;
        this.inner = Math.abs(1 - p);
        this.middle = p < 1 ? 1.0 : p;
        this.outer = 1 + p;
        this.below = p < 1 ? Piece.of(ld, p, inner, -1, 0, inner, zMin, zMax) : null;
        this.rising = Piece.of(ld, p, inner, 1, inner, middle, zMin, zMax);
        this.falling = Piece.of(ld, p, outer, -1, middle, outer, zMin, zMax);
    }

    /** The hidden fraction at separation z ≥ 0 (exact outside the range tabulated). */
    double hiddenFraction(double z) {
        if (z >= outer) {
            return 0.0;
        }
        if (z <= p - 1) {
            return 1.0;
        }
        Piece piece = z < inner ? below : z < middle ? rising : falling;
        if (piece == null || !piece.covers(z)) {
            return Occultation.hiddenFraction(ld, p, z);
        }
        return piece.at(z);
    }

    /**
     * One piece: h at z = contact + direction · s⁴ tabulated at s = sFirst + k · step,
     * k = 0 … STEPS, held as the interpolating polynomial of each step in powers of the position
     * v (0 … 1) within the step.
     */
    private static final class Piece {
        private final double contact;
        private final double direction;
        private final double zLow;
        private final double zHigh;
        private final double sFirst;
        private final double inverseStep;
        /** coefficients[k · NODES + m]: the coefficient of v^m on step k. */
        private final double[] coefficients;

        private Piece(double contact, double direction, double zLow, double zHigh, double sFirst,
                double inverseStep, double[] coefficients) {
            this.contact = contact;
            this.direction = direction;
            this.zLow = zLow;
            this.zHigh = zHigh;
            this.sFirst = sFirst;
            this.inverseStep = inverseStep;
            this.coefficients = coefficients;
        }

        /**
         * The piece between {@code from} and {@code to} in z, cut to [zMin, zMax]; null when
         * they do not meet (or meet in a point).
         */
        static Piece of(LimbDarkening ld, double p, double contact, double direction, double from, double to,
                double zMin, double zMax) {
            double lo = Math.max(from, zMin);
            double hi = Math.min(to, zMax);
            if (!(hi > lo)) {
                return null;
            }
            double sA = Math.sqrt(Math.sqrt(Math.abs(lo - contact)));
            double sB = Math.sqrt(Math.sqrt(Math.abs(hi - contact)));
            double sFirst = Math.min(sA, sB);
            double step = (Math.max(sA, sB) - sFirst) / STEPS;
            if (!(step > 0)) {
                return null;
            }
            double[] values = new double[STEPS + 1];
            for (int k = 0; k <= STEPS; k++) {
                double s = sFirst + k * step;
                double s2 = s * s;
                double z = Math.max(0.0, contact + direction * s2 * s2);
                values[k] = Occultation.hiddenFraction(ld, p, z);
            }
            // each step takes the eight nodes centred on it (shifted inwards at the ends)
            double[] coefficients = new double[STEPS * NODES];
            for (int k = 0; k < STEPS; k++) {
                int first = Math.max(0, Math.min(STEPS - DEGREE, k - (DEGREE - 1) / 2));
                double[] power = POWER[k - first];
                for (int m = 0; m < NODES; m++) {
                    double c = 0;
                    for (int j = 0; j < NODES; j++) {
                        c += power[m * NODES + j] * values[first + j];
                    }
                    coefficients[k * NODES + m] = c;
                }
            }
            return new Piece(contact, direction, lo, hi, sFirst, 1 / step, coefficients);
        }

        boolean covers(double z) {
            return z >= zLow && z <= zHigh;
        }

        /** The interpolated value at z inside the piece. */
        double at(double z) {
            double delta = Math.max(0.0, direction * (z - contact));
            double x = (Math.sqrt(Math.sqrt(delta)) - sFirst) * inverseStep;
            int k = Math.max(0, Math.min(STEPS - 1, (int) x));
            double v = x - k;
            double[] c = coefficients;
            int o = k * NODES;
            double sum = c[o + 7];
            sum = sum * v + c[o + 6];
            sum = sum * v + c[o + 5];
            sum = sum * v + c[o + 4];
            sum = sum * v + c[o + 3];
            sum = sum * v + c[o + 2];
            sum = sum * v + c[o + 1];
            sum = sum * v + c[o];
            return Math.max(0.0, Math.min(1.0, sum));
        }
    }
}

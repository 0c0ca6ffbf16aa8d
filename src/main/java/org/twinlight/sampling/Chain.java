package org.twinlight.sampling;

import java.util.ArrayList;
import java.util.List;

/**
 * The positions of every walker at every step, with their log densities. Filled by the sampler
 * one step at a time; read through {@link #value(int, int, int)} and {@link #series(int, int)}.
 */
public final class Chain {
    private final int walkers;
    private final int dimension;
    private final List<double[]> positions = new ArrayList<>();
    private final List<double[]> logDensities = new ArrayList<>();
    private final List<Integer> accepted = new ArrayList<>();

    Chain(int walkers, int dimension) {
        this.walkers = walkers;
        this.dimension = dimension;
    }

    void add(double[][] x, double[] logp, int acceptedMoves) {
        double[] flat = new double[walkers * dimension];
        for (int w = 0; w < walkers; w++) {
            System.arraycopy(x[w], 0, flat, w * dimension, dimension);
        }
        positions.add(flat);
        logDensities.add(logp.clone());
        accepted.add(acceptedMoves);
    }

    public int walkers() {
        return walkers;
    }

    public int dimension() {
        return dimension;
    }

    /** Steps recorded (per walker). */
    public int steps() {
        return positions.size();
    }

    /** Coordinate {@code k} of walker {@code w} after step {@code step}. */
    public double value(int step, int w, int k) {
        return positions.get(step)[w * dimension + k];
    }

    /** ln p of walker {@code w} after step {@code step}. */
    public double logDensity(int step, int w) {
        return logDensities.get(step)[w];
    }

    /** The position of walker {@code w} after step {@code step} (a copy). */
    public double[] position(int step, int w) {
        double[] p = new double[dimension];
        System.arraycopy(positions.get(step), w * dimension, p, 0, dimension);
        return p;
    }

    /** Coordinate k of every walker from step {@code from} on: [walker][step − from]. */
    public double[][] series(int k, int from) {
        int n = steps() - from;
        double[][] s = new double[walkers][n];
        for (int t = 0; t < n; t++) {
            double[] row = positions.get(from + t);
            for (int w = 0; w < walkers; w++) {
                s[w][t] = row[w * dimension + k];
            }
        }
        return s;
    }

    /** Fraction of proposed moves accepted from step {@code from} on. */
    public double acceptanceFraction(int from) {
        long a = 0;
        for (int t = from; t < steps(); t++) {
            a += accepted.get(t);
        }
        int n = steps() - from;
        return n <= 0 ? Double.NaN : a / ((double) n * walkers);
    }
}

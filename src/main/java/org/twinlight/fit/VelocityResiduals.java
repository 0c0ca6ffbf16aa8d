package org.twinlight.fit;

import java.util.Arrays;
import org.twinlight.velocity.VelocityData;
import org.twinlight.velocity.VelocityModel;
import org.twinlight.velocity.VelocityParameters;

/**
 * The radial velocities of a joint fit as one {@link FitDataSet}: (observed − model)/σ of every
 * measurement by {@link VelocityModel}, with the period, epoch, e and ω of the light curves and the
 * velocity parameters that follow them in the external vector. Nothing is solved inside.
 */
final class VelocityResiduals implements FitDataSet {
    private static final double LN_2PI = Math.log(2 * Math.PI);
    private final JointVelocities velocities;
    /** Index of k1 in the external vector (k2, γ and the offsets follow). */
    private final int base;
    private final int size;
    private final double logNormalisation;

    VelocityResiduals(JointVelocities velocities, int base) {
        this.velocities = velocities;
        this.base = base;
        this.size = velocities.size();
        this.logNormalisation = -velocities.sumLogSigma() - 0.5 * size * LN_2PI;
    }

    @Override
    public int size() {
        return size;
    }

    @Override
    public int usedCount() {
        return size;
    }

    @Override
    public int nuisanceCount() {
        return 0;
    }

    @Override
    public void residuals(double[] ext, double[] out, int off) {
        double[] values = Arrays.copyOfRange(ext, base, ext.length);
        int at = off;
        for (int f = 0; f < velocities.files().size(); f++) {
            VelocityData d = velocities.files().get(f);
            VelocityParameters p = velocities.parameters(f, ext[ParameterLayout.PERIOD], ext[ParameterLayout.EPOCH],
                    ext[ParameterLayout.ECCENTRICITY], ext[ParameterLayout.OMEGA], values);
            double[] r = VelocityModel.normalisedResiduals(d, p, velocities.errorsKms(f, 1), velocities.errorsKms(f, 2));
            System.arraycopy(r, 0, out, at, r.length);
            at += r.length;
        }
    }

    @Override
    public double logNormalisation() {
        return logNormalisation;
    }

    /** Number of velocity files (each may have its own jitter). */
    int fileCount() {
        return velocities.files().size();
    }

    /** The name of file {@code f} for labels: its base name. */
    String fileLabel(int f) {
        return velocities.fileLabel(f);
    }

    /** The median error of file {@code f}'s measurements, both stars, km/s. */
    double medianErrorKms(int f) {
        double[] e1 = velocities.errorsKms(f, 1);
        double[] e2 = velocities.errorsKms(f, 2);
        double[] all = Arrays.copyOf(e1, e1.length + e2.length);
        System.arraycopy(e2, 0, all, e1.length, e2.length);
        return org.twinlight.photometry.RobustStatistics.median(all);
    }

    /**
     * ln L of every measurement with a jitter s per file ({@code jitterKms}) added in quadrature to
     * both stars' errors: {@link VelocityModel#logLikelihood}.
     */
    double logLikelihood(double[] ext, double[] jitterKms) {
        double[] values = Arrays.copyOfRange(ext, base, ext.length);
        double s = 0;
        for (int f = 0; f < velocities.files().size(); f++) {
            VelocityParameters p = velocities.parameters(f, ext[ParameterLayout.PERIOD], ext[ParameterLayout.EPOCH],
                    ext[ParameterLayout.ECCENTRICITY], ext[ParameterLayout.OMEGA], values);
            VelocityParameters withJitter = new VelocityParameters(p.periodDays(), p.epochDays(), p.eccentricity(),
                    p.omegaDeg(), p.k1Kms(), p.k2Kms(), p.gammaKms(), p.offsetsKms(), jitterKms[f], jitterKms[f]);
            s += VelocityModel.logLikelihood(velocities.files().get(f), withJitter, velocities.errorsKms(f, 1),
                    velocities.errorsKms(f, 2));
        }
        return s;
    }

    boolean errorsEstimated() {
        return velocities.errorsEstimated();
    }
}

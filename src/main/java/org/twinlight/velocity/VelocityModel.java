package org.twinlight.velocity;

import org.twinlight.orbit.RadialVelocityCurve;

/**
 * The double-lined Keplerian model of a {@link VelocityData} set as a pure function of
 * {@link VelocityParameters}: model velocities, residuals, normalised residuals and the
 * Gaussian log-likelihood with jitter. This is the velocity data set's part of any objective;
 * the least-squares fit ({@link VelocityFitter}) is one user of it.
 *
 * <p>Star n's measurement from instrument j is modelled as
 * v = γ + δⱼ ± K_n [cos(ν+ω) + e cos ω] (+ for star 1, − for star 2), with δ₀ = 0; its weight
 * is 1/(σ² + s_n²) with s_n the jitter of star n (e.g. Gregory 2005, ApJ 631, 1198, for the jitter term).
 */
public final class VelocityModel {

    private VelocityModel() {
    }

    /**
     * Model and residuals of both stars.
     *
     * @param model1 model velocities of star 1's measurements, km/s
     * @param residual1 observed − model, km/s
     * @param model2 the same for star 2
     * @param residual2 observed − model, km/s
     */
    public record Residuals(double[] model1, double[] residual1, double[] model2, double[] residual2) {
    }

    /** Model velocities of star {@code n}'s measurements, km/s. */
    public static double[] model(StarVelocities s, int n, VelocityParameters p) {
        RadialVelocityCurve curve = p.curve();
        double k = n == 1 ? p.k1Kms() : -p.k2Kms();
        double[] out = new double[s.size()];
        for (int i = 0; i < out.length; i++) {
            out[i] = p.gammaKms() + p.offsetKms(s.instruments()[i]) + k * curve.shape(s.timesDays()[i]);
        }
        return out;
    }

    /** Model velocities at arbitrary times for instrument 0 (for plotting), km/s. */
    public static double[] curve(double[] timesDays, int n, VelocityParameters p) {
        RadialVelocityCurve curve = p.curve();
        double k = n == 1 ? p.k1Kms() : -p.k2Kms();
        double[] out = new double[timesDays.length];
        for (int i = 0; i < out.length; i++) {
            out[i] = p.gammaKms() + k * curve.shape(timesDays[i]);
        }
        return out;
    }

    public static Residuals residuals(VelocityData d, VelocityParameters p) {
        double[] m1 = model(d.star1(), 1, p);
        double[] m2 = model(d.star2(), 2, p);
        return new Residuals(m1, subtract(d.star1().velocitiesKms(), m1), m2, subtract(d.star2().velocitiesKms(), m2));
    }

    /**
     * Residuals divided by √(σ² + s²), star 1 then star 2.
     *
     * @param sigma1 errors of star 1's measurements (the file's, or estimated), km/s
     * @param sigma2 errors of star 2's measurements, km/s
     */
    public static double[] normalisedResiduals(VelocityData d, VelocityParameters p, double[] sigma1, double[] sigma2) {
        Residuals r = residuals(d, p);
        double s1 = p.jitter1Kms() * p.jitter1Kms();
        double s2 = p.jitter2Kms() * p.jitter2Kms();
        double[] out = new double[d.size()];
        int n1 = d.star1().size();
        for (int i = 0; i < n1; i++) {
            out[i] = r.residual1()[i] / Math.sqrt(sigma1[i] * sigma1[i] + s1);
        }
        for (int i = 0; i < d.star2().size(); i++) {
            out[n1 + i] = r.residual2()[i] / Math.sqrt(sigma2[i] * sigma2[i] + s2);
        }
        return out;
    }

    /** The Gaussian log-likelihood −½ Σ [r²/(σ²+s²) + ln 2π(σ²+s²)] of both stars. */
    public static double logLikelihood(VelocityData d, VelocityParameters p, double[] sigma1, double[] sigma2) {
        Residuals r = residuals(d, p);
        return part(r.residual1(), sigma1, p.jitter1Kms() * p.jitter1Kms())
                + part(r.residual2(), sigma2, p.jitter2Kms() * p.jitter2Kms());
    }

    private static double part(double[] r, double[] sigma, double s2) {
        double sum = 0;
        for (int i = 0; i < r.length; i++) {
            double var = sigma[i] * sigma[i] + s2;
            sum += r[i] * r[i] / var + Math.log(2 * Math.PI * var);
        }
        return -0.5 * sum;
    }

    private static double[] subtract(double[] a, double[] b) {
        double[] out = new double[a.length];
        for (int i = 0; i < a.length; i++) {
            out[i] = a[i] - b[i];
        }
        return out;
    }
}

package org.twinlight.velocity;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import org.apache.commons.math3.exception.ConvergenceException;
import org.apache.commons.math3.exception.TooManyEvaluationsException;
import org.apache.commons.math3.exception.TooManyIterationsException;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresBuilder;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresOptimizer;
import org.apache.commons.math3.fitting.leastsquares.LevenbergMarquardtOptimizer;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.RealVector;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.util.Pair;
import org.twinlight.BadInputException;
import org.twinlight.WorkFailedException;
import org.twinlight.statistics.Covariance;
import org.twinlight.statistics.FitStatistics;

/**
 * Least-squares fit of the double-lined velocity model ({@link VelocityModel}) with the
 * Levenberg–Marquardt solver of Commons Math: K1, K2, γ and one offset per instrument after the
 * first always; e and ω (as e cos ω, e sin ω, so e = 0 is no boundary), period and epoch when
 * asked. Uncertainties come from the covariance scaled by max(1, χ²/ν) (the errors by
 * max(1, √(χ²/ν))), the rule the O−C fits use: scatter larger than the stated errors widens them,
 * but a small χ²/ν never shrinks them, because with the few degrees of freedom of a typical
 * velocity set χ²/ν below 1 is mostly chance (its spread is √(2/ν)), and shrinking on it gives
 * confident wrong K and e.
 * Without errors in the file each star's errors are estimated from its scatter (a first fit with
 * equal weights, then the RMS of the star's residuals). With {@code fitJitter} the jitter is the
 * value for each star that makes its χ² equal its share of the degrees of freedom, found by bisection after each fit, and the fit repeated until it
 * settles.
 */
public final class VelocityFitter {

    private static final int JITTER_ROUNDS = 20;
    /** A negative K beyond this many σ from 0 is the input's fault, not chance. */
    private static final double SIGNIFICANT_K = 3.0;

    private VelocityFitter() {
    }

    /**
     * Fits.
     *
     * @param data the velocities
     * @param start starting parameters (its offsets must match the data's instruments)
     * @param settings what to fit
     * @throws BadInputException when star 2 has no velocities, or there are too few
     * @throws WorkFailedException when the solver does not converge
     */
    public static VelocityFitResult fit(VelocityData data, VelocityParameters start, VelocityFitSettings settings) {
        if (data.star2().size() == 0) {
            throw new BadInputException(data.source() + ": column 'v2': no velocities of star 2; K2, the mass "
                    + "ratio and the masses need both stars (a double-lined binary)");
        }
        if (data.star1().size() == 0) {
            throw new BadInputException(data.source() + ": column 'v1': no velocities of star 1; K1 needs them");
        }
        if (start.instrumentCount() != data.instruments().size()) {
            throw new IllegalArgumentException("the starting parameters have " + start.instrumentCount()
                    + " offsets for " + data.instruments().size() + " instruments");
        }
        Layout layout = new Layout(settings, data.instruments());
        if (data.size() <= layout.size()) {
            throw new BadInputException(data.source() + ": " + data.size() + " velocities for " + layout.size()
                    + " fitted quantities (" + String.join(", ", layout.names) + "); at least one more is needed, "
                    + "and many more for meaningful errors");
        }
        boolean estimated = !data.star1().hasErrors() || !data.star2().hasErrors();
        double[] sigma1 = errors(data.star1());
        double[] sigma2 = errors(data.star2());
        double fixedJitter = settings.fitJitter() ? 0.0 : settings.jitterKms();
        VelocityParameters p = start.withJitterKms(fixedJitter, fixedJitter);
        int iterations = 0;
        Solved solved = solve(data, p, layout, sigma1, sigma2, settings.maxIterations());
        iterations += solved.iterations;
        p = solved.best;
        if (estimated) {
            VelocityModel.Residuals r = VelocityModel.residuals(data, p);
            double correction = Math.sqrt((double) data.size() / (data.size() - layout.size()));
            if (!data.star1().hasErrors()) {
                Arrays.fill(sigma1, rms(r.residual1()) * correction);
            }
            if (!data.star2().hasErrors()) {
                Arrays.fill(sigma2, rms(r.residual2()) * correction);
            }
            solved = solve(data, p, layout, sigma1, sigma2, settings.maxIterations());
            iterations += solved.iterations;
            p = solved.best;
        }
        List<String> notes = new ArrayList<>();
        if (settings.fitJitter()) {
            // each star's share of the degrees of freedom, so each star's chi2 matches its own share
            double share = (double) (data.size() - layout.size()) / data.size();
            for (int round = 0; round < JITTER_ROUNDS; round++) {
                VelocityModel.Residuals r = VelocityModel.residuals(data, p);
                double s1 = jitterForUnitReducedChi2(r.residual1(), sigma1, share * data.star1().size());
                double s2 = jitterForUnitReducedChi2(r.residual2(), sigma2, share * data.star2().size());
                boolean settled = Math.abs(s1 - p.jitter1Kms()) <= 1e-3 * Math.max(s1, 1e-3)
                        && Math.abs(s2 - p.jitter2Kms()) <= 1e-3 * Math.max(s2, 1e-3);
                p = p.withJitterKms(s1, s2);
                if (settled) {
                    break;
                }
                solved = solve(data, p, layout, sigma1, sigma2, settings.maxIterations());
                iterations += solved.iterations;
                p = solved.best.withJitterKms(s1, s2);
            }
            notes.add(String.format(Locale.ROOT, "jitter %.3f km/s (star 1) and %.3f km/s (star 2) added in "
                    + "quadrature to the errors: the values for which each star's chi2 equals its share of the "
                    + "degrees of freedom (zero when the scatter is within the errors)", p.jitter1Kms(),
                    p.jitter2Kms()));
        }
        if (estimated) {
            notes.add("the file gives no errors for " + (!data.star1().hasErrors() && !data.star2().hasErrors()
                    ? "either star" : !data.star1().hasErrors() ? "star 1" : "star 2")
                    + ": they were estimated from the scatter of the residuals, so chi2 says nothing about the fit");
        }
        return summarise(data, p, layout, sigma1, sigma2, solved, iterations, estimated, notes, settings);
    }

    /**
     * K1 and K2 are positive by the model's convention (v1 = γ + K1[cos(ν+ω) + e cos ω], v2 with
     * −K2, the epoch the primary conjunction; INTERFACE.md); a fit that converges to a negative
     * one either says the input does not follow it (both clearly negative: the stars or the epoch
     * swapped; one clearly negative: the same star twice) or that the data do not determine K
     * (within {@value #SIGNIFICANT_K} σ of 0).
     *
     * @throws BadInputException when a negative K is significant, saying what to try
     * @throws WorkFailedException when a negative K is consistent with 0
     */
    private static void checkSigns(VelocityData data, VelocityParameters p, double sigmaK1, double sigmaK2) {
        if (p.k1Kms() >= 0 && p.k2Kms() >= 0) {
            return;
        }
        String fitted = String.format(Locale.ROOT, "K1 = %.2f ± %.2f km/s and K2 = %.2f ± %.2f km/s", p.k1Kms(),
                sigmaK1, p.k2Kms(), sigmaK2);
        boolean clear1 = p.k1Kms() < -SIGNIFICANT_K * sigmaK1;
        boolean clear2 = p.k2Kms() < -SIGNIFICANT_K * sigmaK2;
        if (clear1 && clear2) {
            throw new BadInputException(data.source() + ": the fit gives negative semi-amplitudes (" + fitted
                    + "): each star moves opposite to the model's orbit. Either the velocity columns of the two "
                    + "stars are swapped (star 1 is the star eclipsed at primary minimum) or the epoch is that of "
                    + "the other eclipse, half a period off. Try swapping the columns of the stars "
                    + "(--v1-column/--v2-column and --v1-error-column/--v2-error-column), or check the epoch "
                    + "of the model");
        }
        if ((clear1 && p.k2Kms() > 0) || (clear2 && p.k1Kms() > 0)) {
            throw new BadInputException(data.source() + ": the fit gives " + fitted + ": one of the two stars moves "
                    + "with the other instead of opposite to it, so the columns 'v1' and 'v2' do not hold the two "
                    + "stars of a double-lined orbit (the same star twice, or velocities of one star split between "
                    + "them?). Check the columns chosen with --v1-column/--v2-column");
        }
        throw new WorkFailedException(data.source() + ": the fit gives " + fitted + ": a negative semi-amplitude "
                + "within " + (int) SIGNIFICANT_K + " sigma of 0, so these " + data.size() + " velocities do not "
                + "determine it (too few, too noisy, or all near conjunction where both stars move at gamma). Try "
                + "more velocities near the quadratures (phases 0.25 and 0.75), or fewer free parameters; if the "
                + "columns or the epoch could be wrong, check them too");
    }

    private static double[] errors(StarVelocities s) {
        if (s.hasErrors()) {
            return s.errorsKms().clone();
        }
        double[] e = new double[s.size()];
        Arrays.fill(e, 1.0);
        return e;
    }

    private record Solved(VelocityParameters best, RealMatrix jacobian, int iterations) {
    }

    private static Solved solve(VelocityData data, VelocityParameters start, Layout layout, double[] sigma1,
            double[] sigma2, int maxIterations) {
        int m = data.size();
        double[] x0 = layout.toVector(start);
        double[] steps = layout.steps(start);
        org.apache.commons.math3.fitting.leastsquares.MultivariateJacobianFunction f = point -> {
            double[] x = point.toArray();
            double[] r = residuals(data, layout.toParameters(x, start), sigma1, sigma2);
            double[][] jac = new double[m][x.length];
            for (int j = 0; j < x.length; j++) {
                double[] up = x.clone();
                double[] down = x.clone();
                up[j] += steps[j];
                down[j] -= steps[j];
                double[] ru = residuals(data, layout.toParameters(up, start), sigma1, sigma2);
                double[] rd = residuals(data, layout.toParameters(down, start), sigma1, sigma2);
                for (int i = 0; i < m; i++) {
                    jac[i][j] = (ru[i] - rd[i]) / (2 * steps[j]);
                }
            }
            return new Pair<RealVector, RealMatrix>(new ArrayRealVector(r, false), new Array2DRowRealMatrix(jac, false));
        };
        LeastSquaresOptimizer.Optimum optimum;
        try {
            optimum = new LevenbergMarquardtOptimizer()
                    .withCostRelativeTolerance(1e-12)
                    .withParameterRelativeTolerance(1e-12)
                    .optimize(new LeastSquaresBuilder().start(x0).target(new double[m]).model(f)
                            .parameterValidator(v -> layout.validate(v))
                            .maxIterations(maxIterations).maxEvaluations(maxIterations * 4).build());
        } catch (TooManyIterationsException | TooManyEvaluationsException e) {
            throw new WorkFailedException("the velocity fit did not converge within " + maxIterations
                    + " iterations. Try: a starting K1, K2 and gamma closer to the data, fix e and omega, or raise "
                    + "--max-iterations");
        } catch (ConvergenceException e) {
            throw new WorkFailedException("the velocity fit failed: " + e.getMessage() + ". Try fewer free "
                    + "parameters or a starting model closer to the data");
        }
        double[] best = optimum.getPoint().toArray();
        return new Solved(layout.toParameters(best, start), optimum.getJacobian(), optimum.getIterations());
    }

    /** Residuals as the solver sees them: (model − observed)/σ with the sign the target of 0 needs. */
    private static double[] residuals(VelocityData d, VelocityParameters p, double[] sigma1, double[] sigma2) {
        double[] r = VelocityModel.normalisedResiduals(d, p, sigma1, sigma2);
        for (int i = 0; i < r.length; i++) {
            r[i] = -r[i];
        }
        return r;
    }

    /** The jitter s with Σ r²/(σ² + s²) = {@code dof}, by bisection; 0 when the errors already suffice. */
    private static double jitterForUnitReducedChi2(double[] r, double[] sigma, double dof) {
        if (chi2(r, sigma, 0) <= dof) {
            return 0.0;
        }
        double lo = 0;
        double hi = rms(r) * 10 + 1e-6;
        for (int i = 0; i < 100; i++) {
            double mid = 0.5 * (lo + hi);
            if (chi2(r, sigma, mid) > dof) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return 0.5 * (lo + hi);
    }

    private static double chi2(double[] r, double[] sigma, double jitter) {
        double s2 = jitter * jitter;
        double sum = 0;
        for (int i = 0; i < r.length; i++) {
            sum += r[i] * r[i] / (sigma[i] * sigma[i] + s2);
        }
        return sum;
    }

    private static double rms(double[] r) {
        if (r.length == 0) {
            return Double.NaN;
        }
        double s = 0;
        for (double v : r) {
            s += v * v;
        }
        return Math.sqrt(s / r.length);
    }

    private static VelocityFitResult summarise(VelocityData data, VelocityParameters p, Layout layout,
            double[] sigma1, double[] sigma2, Solved solved, int iterations, boolean estimated, List<String> notes,
            VelocityFitSettings settings) {
        VelocityModel.Residuals r = VelocityModel.residuals(data, p);
        double chi2 = chi2(r.residual1(), sigma1, p.jitter1Kms()) + chi2(r.residual2(), sigma2, p.jitter2Kms());
        int dof = data.size() - layout.size();
        double reduced = chi2 / dof;
        // the project's one rule (FitStatistics.varianceScale): never below 1 with stated errors, since a small
        // chi2/nu on few degrees of freedom is chance as often as it is overstated errors, and shrinking on it
        // made K and e confidently wrong on small sets
        double scale = FitStatistics.varianceScale(chi2, dof, estimated);
        // the Jacobian at the optimum, recomputed with the final jitter
        double[][] c;
        try {
            c = Covariance.fromNormalMatrix(Covariance.normalMatrix(solved.jacobian.getData()), scale);
        } catch (Covariance.Degenerate e) {
            throw new WorkFailedException("the velocity fit cannot tell its parameters apart (singular covariance: "
                    + String.join(", ", layout.names) + "); free fewer parameters or add velocities that cover more "
                    + "of the orbit");
        }
        double[][] corr = FitStatistics.correlation(c);
        List<VelocityEstimate> est = layout.estimates(p, c, data.instruments());
        checkSigns(data, p, Math.sqrt(c[0][0]), Math.sqrt(c[1][1]));
        if (reduced < 1 && !estimated && settings.fitJitter() && p.jitter1Kms() == 0 && p.jitter2Kms() == 0) {
            notes.add(String.format(Locale.ROOT, "jitter fitted as 0 km/s for both stars: chi2/nu = %.2f is below "
                    + "1 without it; the uncertainties come from the stated errors alone, not scaled down", reduced));
        }
        // a chi2/nu more than its own 1-sigma spread √(2/ν) below 1 is worth a note
        if (reduced < 1 - Math.sqrt(2.0 / dof) && !estimated) {
            notes.add(String.format(Locale.ROOT, "chi2/nu = %.2f < 1: the scatter is smaller than the stated errors "
                    + "(overstated errors, or chance: with nu = %d its spread is %.2f); the uncertainties are "
                    + "the stated errors' ones, not scaled down", reduced, dof, Math.sqrt(2.0 / dof)));
        } else if (reduced > 2 && !estimated) {
            notes.add(String.format(Locale.ROOT, "chi2/nu = %.2f: the scatter is larger than the errors; the "
                    + "uncertainties were scaled up with it (consider --jitter fit, or look for an instrument with "
                    + "an offset or a bad point)", reduced));
        }
        if (dof < 10) {
            notes.add(String.format(Locale.ROOT, "only %d degrees of freedom (%d velocities, %d fitted quantities): "
                    + "the uncertainties rest on the stated errors and are themselves uncertain; more velocities "
                    + "spread over the orbit would settle K1 and K2", dof, data.size(), layout.size()));
        }
        return new VelocityFitResult(p, est, List.copyOf(layout.names), corr, c, sigma1, sigma2, data.size(), chi2,
                dof, rms(r.residual1()), rms(r.residual2()), iterations, estimated, notes);
    }

    /** Which quantities are fitted, in which order, and how they map to parameters. */
    private static final class Layout {
        final List<String> names = new ArrayList<>();
        final boolean eccentric;
        final boolean period;
        final boolean epoch;
        final int offsets;

        Layout(VelocityFitSettings s, List<String> instruments) {
            names.addAll(List.of("k1", "k2", "gamma"));
            eccentric = s.eccentric();
            if (eccentric) {
                names.addAll(List.of("eCosOmega", "eSinOmega"));
            }
            period = s.free().contains("period");
            if (period) {
                names.add("period");
            }
            epoch = s.free().contains("epoch");
            if (epoch) {
                names.add("epoch");
            }
            offsets = instruments.size() - 1;
            for (int i = 1; i < instruments.size(); i++) {
                names.add("offset." + instruments.get(i));
            }
        }

        int size() {
            return names.size();
        }

        double[] toVector(VelocityParameters p) {
            double[] x = new double[size()];
            int i = 0;
            x[i++] = p.k1Kms();
            x[i++] = p.k2Kms();
            x[i++] = p.gammaKms();
            if (eccentric) {
                double w = Math.toRadians(p.omegaDeg());
                x[i++] = p.eccentricity() * Math.cos(w);
                x[i++] = p.eccentricity() * Math.sin(w);
            }
            if (period) {
                x[i++] = p.periodDays();
            }
            if (epoch) {
                x[i++] = p.epochDays();
            }
            for (int j = 1; j <= offsets; j++) {
                x[i++] = p.offsetKms(j);
            }
            return x;
        }

        VelocityParameters toParameters(double[] x, VelocityParameters base) {
            int i = 3;
            double e = base.eccentricity();
            double w = base.omegaDeg();
            if (eccentric) {
                double h = x[i++];
                double k = x[i++];
                e = Math.hypot(h, k);
                w = e > 0 ? Math.toDegrees(Math.atan2(k, h)) : base.omegaDeg();
                if (w < 0) {
                    w += 360;
                }
            }
            double pd = period ? x[i++] : base.periodDays();
            double t0 = epoch ? x[i++] : base.epochDays();
            double[] off = new double[offsets + 1];
            for (int j = 1; j <= offsets; j++) {
                off[j] = x[i++];
            }
            return new VelocityParameters(pd, t0, e, w, x[0], x[1], x[2], off, base.jitter1Kms(), base.jitter2Kms());
        }

        /** Keeps the solver inside the model's domain: e below 0.95, a positive period. */
        RealVector validate(RealVector v) {
            double[] x = v.toArray();
            if (eccentric) {
                double e = Math.hypot(x[3], x[4]);
                if (e > 0.95) {
                    x[3] *= 0.95 / e;
                    x[4] *= 0.95 / e;
                }
            }
            return new ArrayRealVector(x, false);
        }

        double[] steps(VelocityParameters p) {
            double[] s = new double[size()];
            int i = 0;
            double kScale = Math.max(1.0, 0.5 * (Math.abs(p.k1Kms()) + Math.abs(p.k2Kms())));
            s[i++] = 1e-5 * kScale;
            s[i++] = 1e-5 * kScale;
            s[i++] = 1e-5 * kScale;
            if (eccentric) {
                s[i++] = 1e-6;
                s[i++] = 1e-6;
            }
            if (period) {
                s[i++] = 1e-8 * p.periodDays();
            }
            if (epoch) {
                s[i++] = 1e-6 * p.periodDays();
            }
            for (int j = 1; j <= offsets; j++) {
                s[i++] = 1e-5 * kScale;
            }
            return s;
        }

        List<VelocityEstimate> estimates(VelocityParameters p, double[][] c, List<String> instruments) {
            List<VelocityEstimate> out = new ArrayList<>();
            out.add(new VelocityEstimate("k1", p.k1Kms(), Math.sqrt(c[0][0]), true, "km/s"));
            out.add(new VelocityEstimate("k2", p.k2Kms(), Math.sqrt(c[1][1]), true, "km/s"));
            out.add(new VelocityEstimate("gamma", p.gammaKms(), Math.sqrt(c[2][2]), true, "km/s"));
            int i = 3;
            if (eccentric) {
                // e = √(h²+k²), ω = atan2(k, h): first-order propagation of the (h, k) covariance
                double h = p.eccentricity() * Math.cos(Math.toRadians(p.omegaDeg()));
                double k = p.eccentricity() * Math.sin(Math.toRadians(p.omegaDeg()));
                double e = p.eccentricity();
                double vh = c[i][i];
                double vk = c[i + 1][i + 1];
                double hk = c[i][i + 1];
                double se = e > 0 ? Math.sqrt(Math.max(0, (h * h * vh + k * k * vk + 2 * h * k * hk) / (e * e)))
                        : Math.sqrt(0.5 * (vh + vk));
                double sw = e > 0 ? Math.toDegrees(Math.sqrt(Math.max(0, (k * k * vh + h * h * vk - 2 * h * k * hk)
                        / (e * e * e * e)))) : Double.NaN;
                out.add(new VelocityEstimate("eccentricity", e, se, true, ""));
                out.add(new VelocityEstimate("omega", p.omegaDeg(), sw, true, "deg"));
                i += 2;
            } else {
                out.add(new VelocityEstimate("eccentricity", p.eccentricity(), 0.0, false, ""));
                out.add(new VelocityEstimate("omega", p.omegaDeg(), 0.0, false, "deg"));
            }
            out.add(new VelocityEstimate("period", p.periodDays(), period ? Math.sqrt(c[i][i]) : 0.0, period, "d"));
            if (period) {
                i++;
            }
            out.add(new VelocityEstimate("epoch", p.epochDays(), epoch ? Math.sqrt(c[i][i]) : 0.0, epoch, "d"));
            if (epoch) {
                i++;
            }
            for (int j = 1; j <= offsets; j++) {
                out.add(new VelocityEstimate("offset." + instruments.get(j), p.offsetKms(j), Math.sqrt(c[i][i]), true,
                        "km/s"));
                i++;
            }
            return out;
        }
    }
}

package org.twinlight.timing.period;

/**
 * A trial period with its statistics.
 *
 * @param periodDays the period, days
 * @param blsPower BLS signal residue SR at this period (NaN when outside the searched range)
 * @param sde signal detection efficiency of this peak, (SR − median SR)/(1.4826·MAD SR) over the periodogram
 * @param pdmTheta Stellingwerf's Θ at this period (about 1 for no signal, smaller is better)
 * @param role why it is listed: {@code best}, {@code runner-up}, {@code half}, {@code double},
 *     {@code bls-peak}
 */
public record PeriodCandidate(double periodDays, double blsPower, double sde, double pdmTheta, String role) {
}

/**
 * The whole analysis of one target, from raw light curve to report: the stages of the library
 * (reading, period search, times of minimum and ephemeris, starting values, least-squares fit from
 * several starts, and when asked the joint fit with radial velocities, the posterior sample and the
 * absolute dimensions) wired together as one self-contained unit of work,
 * {@link org.twinlight.analysis.TargetAnalysis#run(AnalysisRequest)}, and the report page and
 * {@code results.json} that present it.
 *
 * <p>An outer layer: it may use the library core and {@code report}, never {@code cli}; it keeps no
 * shared mutable state, never exits the virtual machine and prints nothing except through the
 * message sink it is given, so that many targets can run at once in one JVM or on a cluster.
 */
package org.twinlight.analysis;

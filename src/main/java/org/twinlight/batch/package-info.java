/**
 * Many targets, one unit of work each: discovery of the targets (a folder of light curves or a
 * manifest CSV), a runner that executes a unit of work per target on several threads, a journal
 * that makes an interrupted batch resumable, and the batch's summary ({@code summary.csv},
 * {@code index.html}).
 *
 * <p>An outer layer beside {@code report}: it uses the library core, {@code report} and {@code analysis}
 * (whose {@code TargetAnalysis.run} is the unit of work of the batch command), never
 * {@code cli}. The unit of work ({@link org.twinlight.batch.UnitOfWork}) takes one
 * {@link org.twinlight.batch.BatchTarget} (everything it needs, including its own output folder)
 * and returns a {@link org.twinlight.batch.TargetResult}; it shares no mutable state with other
 * targets, so the same function runs unchanged on a cluster engine, one target per task.
 */
package org.twinlight.batch;

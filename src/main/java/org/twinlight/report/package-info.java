/**
 * The outer layer that turns results into files: plots (XChart PNG), the HTML report, JSON and
 * CSV writers, all written atomically. Uses the library packages; they never use it.
 */
package org.twinlight.report;

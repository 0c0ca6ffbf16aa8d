/**
 * Time scales and Julian dates: which clock and which reference point a column of times uses,
 * conversions between UTC, TAI, TT and TDB, and heliocentric/barycentric light-time corrections.
 *
 * <p>Independent of every other twinlight package.
 */
package org.twinlight.time;

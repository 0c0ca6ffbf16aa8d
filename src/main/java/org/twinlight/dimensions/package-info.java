/**
 * Absolute dimensions: physical constants with their provenance, masses and radii from Kepler's
 * third law, luminosities from the Stefan–Boltzmann law.
 */
package org.twinlight.dimensions;

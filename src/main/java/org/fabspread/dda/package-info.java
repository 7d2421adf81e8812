/**
 * The discrete-dipole approximation for one particle in a homogeneous host (Purcell &amp; Pennypacker 1973;
 * Draine &amp; Flatau 1994) and the shape tables built with it: {@link org.fabspread.dda.DdaSolver} solves one
 * particle at one wavelength, {@link org.fabspread.dda.ShapeTabulator} fills a
 * {@link org.fabspread.dda.ShapeTable} over a grid of uncertain shape parameters and wavelengths, and
 * {@link org.fabspread.dda.TableCache} keeps it on disk keyed by a SHA-256 of everything that enters.
 */
package org.fabspread.dda;

/**
 * Turns samples into answers: variance contributions (Sobol indices on the Saltelli design, given-data
 * screening), yield with score and exact intervals, process capability, what-ifs by likelihood-ratio
 * reweighting, and which tolerance to tighten. Depends on {@code model}, {@code sampling} and
 * {@code study} only.
 */
package org.fabspread.analysis;

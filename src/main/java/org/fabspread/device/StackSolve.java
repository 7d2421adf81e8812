package org.fabspread.device;

/**
 * The result of one transfer-matrix solve of the whole device ({@link OpticsStage#solve}) with an
 * incoherent substrate folded in. A mutable holder, one per evaluator.
 */
final class StackSolve {
    /** total reflectance R. */
    double reflectance;
    /** total transmittance T into the exit air. */
    double transmittance;
    /** absorptance of the incoherent substrate (0 without one). */
    double substrate;
    /** the substrate's entry factor: every coherent absorptance is scaled by it (1 without a substrate). */
    double entry;
}

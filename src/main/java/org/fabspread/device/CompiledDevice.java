package org.fabspread.device;

import java.util.List;

import org.fabspread.model.OutputDef;
import org.fabspread.optics.LayerOptics;
import org.fabspread.study.Study;

/**
 * A study compiled once for evaluation ({@link StudyCompiler}): the grid and photon flux, the parameter
 * vector, the named slot records each stage reads, the stack's layout and the output positions.
 * Immutable after compilation and shared by every evaluator (one per thread).
 *
 * @param study       the study
 * @param optics      n, k of every layer interpolated on the grid
 * @param lambda      the wavelength grid, nm
 * @param flux        ASTM G173-03 global photons m⁻² s⁻¹ per wavelength bin
 * @param totalFlux   the sum of {@code flux}
 * @param parameters  the flat parameter vector
 * @param inputIds    ids of the uncertain inputs, in the order of the model's input vector
 * @param stack       the layers' slots
 * @param layout      the computational layers and the particles' place in the stack
 * @param particles   the particle layer (null: none)
 * @param collection  the charge-collection slots
 * @param diode       the one-diode slots (null: no diode block)
 * @param outputs     the output definitions
 * @param outputSlots the outputs' positions
 */
record CompiledDevice(Study study, LayerOptics optics, double[] lambda, double[] flux, double totalFlux,
                      ParameterVector parameters, List<String> inputIds, StackSlots stack, StackLayout layout, ParticleSetup particles,
                      CollectionSlots collection, DiodeSlots diode, List<OutputDef> outputs,
                      OutputSlots outputSlots) {

    /** Number of wavelengths of the grid. */
    int wavelengths() {
        return lambda.length;
    }

    /** Whether the built-in particle optics run (a particle layer without an enhancement table). */
    boolean builtInParticles() {
        return particles != null && !particles.usesTable();
    }

    /** Whether a user's enhancement table replaces the particle optics. */
    boolean usesTable() {
        return particles != null && particles.usesTable();
    }

    /** The same compiled study with another particle setup (null: none). */
    CompiledDevice withParticles(ParticleSetup p) {
        return new CompiledDevice(study, optics, lambda, flux, totalFlux, parameters, inputIds, stack, layout, p,
                collection, diode, outputs, outputSlots);
    }
}

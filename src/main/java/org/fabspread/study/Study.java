package org.fabspread.study;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * A parsed, validated study: everything one run needs. Immutable.
 *
 * <p>{@link #parameters()} lists every number of the study in document order, keyed by its stable
 * id; {@link #uncertainInputs()} is the subset with a distribution: those are the model's inputs.
 *
 * @param file        the study file (null when built in code)
 * @param costs       cost of halving each input's sigma, by input id (arbitrary currency)
 */
public record Study(Path file, String name, String description, WavelengthGrid grid, List<Layer> stack,
                    ParticleLayer particles, ChargeCollection collection, Diode diode, List<Target> targets,
                    AnalysisSettings analysis, PlanSettings plan, Map<String, Double> costs,
                    List<Correlation> correlations) {

    public Study {
        stack = List.copyOf(stack);
        targets = List.copyOf(targets);
        costs = Collections.unmodifiableMap(new LinkedHashMap<>(costs));
        correlations = List.copyOf(correlations);
    }

    public Optional<ParticleLayer> particleLayer() {
        return Optional.ofNullable(particles);
    }

    public Optional<Diode> diodeModel() {
        return Optional.ofNullable(diode);
    }

    /** Every parameter in document order, by id. */
    public Map<String, Parameter> parameters() {
        Map<String, Parameter> m = new LinkedHashMap<>();
        for (Layer l : stack) {
            put(m, l.thickness());
            put(m, l.nShift());
            put(m, l.kScale());
        }
        if (particles != null) {
            put(m, particles.offset());
            put(m, particles.diameter());
            put(m, particles.sizeCv());
            put(m, particles.inPlaneAspect());
            put(m, particles.outOfPlaneAspect());
            put(m, particles.coverage());
            put(m, particles.forwardFraction());
            if (particles.shape() != null) {
                particles.shape().parameters().values().forEach(sp -> put(m, sp));
            }
            MetalParameters mp = particles.metalParameters();
            put(m, mp.plasmaEnergyEv());
            put(m, mp.bulkDampingEv());
            put(m, mp.fermiVelocity());
            put(m, mp.surfaceScattering());
        }
        put(m, collection.dissociation());
        put(m, collection.electronMuTau());
        put(m, collection.holeMuTau());
        put(m, collection.builtInVoltage());
        put(m, collection.quenchingDistance());
        if (diode != null) {
            put(m, diode.saturationCurrent());
            put(m, diode.ideality());
            put(m, diode.seriesResistance());
            put(m, diode.shuntResistance());
            put(m, diode.temperature());
        }
        return Collections.unmodifiableMap(m);
    }

    /** The parameters that carry a distribution, in document order: the model's inputs. */
    public List<Parameter> uncertainInputs() {
        List<Parameter> out = new ArrayList<>();
        for (Parameter p : parameters().values()) {
            if (p.isUncertain()) {
                out.add(p);
            }
        }
        return List.copyOf(out);
    }

    public Layer layer(String name) {
        for (Layer l : stack) {
            if (l.name().equals(name)) {
                return l;
            }
        }
        throw new IllegalArgumentException("no layer " + name);
    }

    private static void put(Map<String, Parameter> m, Parameter p) {
        if (p != null) {
            m.put(p.id(), p);
        }
    }
}

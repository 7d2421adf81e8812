package org.fabspread.report;

import java.util.ArrayList;
import java.util.List;

import org.fabspread.study.Correlation;
import org.fabspread.study.ParticleLayer;
import org.fabspread.study.Study;

/**
 * The limits of the device model and of the statistics that every report repeats (device-model.md
 * §4.5 "Limits to state in every report" and its assumptions on diffuse light, §5 on the diode, the
 * device model's own list), and the cautions that close every report.
 */
public final class ModelLimits {

    private ModelLimits() {
    }

    /** The physical model's limits, adapted to what the study uses. */
    public static List<String> physics(Study study) {
        List<String> out = new ArrayList<>();
        out.add("Light arrives at normal incidence with the ASTM G173-03 global spectrum; angles of incidence, "
                + "other spectra and temperature effects on the optics are not modelled.");
        ParticleLayer p = study.particles();
        if (p != null) {
            out.add("The near field that the particles push into a neighbouring absorber is a point-dipole estimate "
                    + "without the image field of the interface; half of it is the field component normal to the "
                    + "interface, which the ignored dielectric contrast would reduce (roughly by |ε_host/ε_absorber|²).");
            out.add("The particle layer is treated as laterally homogeneous: no grating, diffraction or "
                    + "guided-mode coupling, which ordered or dense particle arrays can show.");
            out.add("The local field is the 3D Lorentz field, an approximation for a monolayer; image fields in "
                    + "the substrate and neighbouring layers are ignored.");
            out.add("Particles are independent beyond the effective-medium mixing rule ("
                    + (p.mixingRule() == ParticleLayer.MixingRule.BRUGGEMAN ? "Bruggeman" : "Maxwell Garnett")
                    + "): no near-field coupling between particles, no clustering.");
            out.add("Scattered light becomes diffuse light treated by ray optics in a film of about 100 nm, which "
                    + "strains that picture: every reflection re-randomises direction, the back reflectance does "
                    + "not depend on angle, the escape cone has no Fresnel loss, and absorption in the layers the "
                    + "light crosses on its way to the absorber is ignored.");
            if (!p.aligned()) {
                out.add("For randomly oriented non-spherical particles the effective permittivity is averaged over "
                        + "the two in-plane axes before one optical solve, rather than averaging the two "
                        + "polarisations' optical responses.");
            }
        }
        out.add("Charge collection uses the Hecht relation with a uniform internal field at short circuit; "
                + "exciton dissociation is one efficiency for the whole absorber.");
        if (study.diode() != null) {
            out.add("In the one-diode model the photocurrent does not depend on voltage, so V_oc, FF and "
                    + "efficiency are an estimate that ignores field-dependent collection.");
        }
        return out;
    }

    /** The limits of the statistics: intervals, Sobol indices with correlated inputs, reweighting, plan noise. */
    public static List<String> statistics(Study study) {
        List<String> out = new ArrayList<>();
        out.add("Every interval describes Monte Carlo sampling error only; it says nothing about the error of "
                + "the model itself, which can be larger.");
        List<Correlation> corr = study.correlations();
        if (corr.isEmpty()) {
            out.add("Sobol indices and yield assume the inputs are independent, as the study states them.");
        } else {
            List<String> pairs = new ArrayList<>();
            for (Correlation c : corr) {
                pairs.add(c.first() + " with " + c.second() + " (Spearman " + Numbers.num3(c.spearman()) + ")");
            }
            out.add("The study correlates " + String.join("; ", pairs) + ". Sobol indices are computed for the "
                    + "independent underlying variables of the Gaussian copula, not for the correlated inputs "
                    + "themselves: a correlated input's share includes part of its partner's influence.");
        }
        out.add("What-ifs and the tolerance ranking and allocation reweight the existing samples (importance "
                + "sampling): they assume the model is unchanged and the new input distribution lies within the "
                + "old one's support; with few effective samples the estimate is unreliable and a new run is "
                + "needed, as the tables say.");
        out.add("C_pk assumes a normal output; when the output is skewed, the counted yield is the better number.");
        if (study.plan() != null) {
            out.add("The experiment plan's noise and predicted effects come from the model (the uncontrolled "
                    + "inputs drawn from their distributions), not from measured run-to-run scatter; real runs add "
                    + "measurement error, so the power may be lower than stated.");
        }
        return out;
    }

    /** The cautions that close every report. */
    public static List<Block> cautions() {
        return List.of(
                new Caution("This report describes a model with the limits stated above. It is not a certification "
                        + "of any device, process or product, and its numbers guarantee nothing about real cells."),
                new Caution("Electrical and laboratory safety come first: solvents (including chlorinated solvents "
                        + "for the blend), nanoparticle dispersions and powders (inhalation and skin contact), "
                        + "evaporators and sputter tools (vacuum, high voltage, hot sources), solar simulators (UV "
                        + "and bright light) and electrical measurements. Your site's safety rules and local "
                        + "regulations take precedence over anything in this report."),
                new Caution("Verify with experiments on the line before changing a process specification (the "
                        + "study report's \"Suggested experiments\" section proposes a plan, or says why it could not)."));
    }

    /** The whole limits-and-cautions section. */
    static Section section(String id, Study study, List<String> extraNotes) {
        List<Block> blocks = new ArrayList<>();
        blocks.add(new Paragraph("The device model behind these numbers makes the following simplifications. "
                + "Read every figure above with them in mind."));
        blocks.add(new BulletList(physics(study)));
        blocks.add(new Paragraph("The statistics rest on these assumptions:"));
        blocks.add(new BulletList(statistics(study)));
        List<String> notes = new ArrayList<>();
        for (String n : extraNotes) {
            if (n != null && !n.isBlank()) {
                notes.add(n.strip());
            }
        }
        if (!notes.isEmpty()) {
            blocks.add(new Paragraph("Notes from this run:"));
            blocks.add(new BulletList(notes));
        }
        blocks.addAll(cautions());
        return new Section(id, "Limits of this model and cautions", blocks);
    }
}

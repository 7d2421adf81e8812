package org.fabspread.device;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;

import org.fabspread.model.OutputDef;

/**
 * The position of each output of the device model in the output vector (−1: the study does not ask for
 * it), and the outputs' definitions. The planar reference ({@code jsc_planar}, {@code enhancement}) comes
 * with {@code analysis.planar_reference}; V_oc, FF and efficiency with a diode block.
 */
record OutputSlots(int jsc, int jscOptical, int absorptance, int metal, int electrodes, int transport, int substrate,
                   int scattering, int quenching, int collection, int reflection, int transmission, int planar,
                   int enhancement, int voc, int ff, int efficiency) {
    static final String JSC = "jsc";
    static final String JSC_OPTICAL = "jsc_optical";
    static final String ABSORPTANCE = "absorber_absorptance";
    static final String LOSS_METAL = "loss_metal";
    static final String LOSS_ELECTRODES = "loss_electrodes";
    static final String LOSS_TRANSPORT = "loss_transport";
    static final String LOSS_SUBSTRATE = "loss_substrate";
    static final String LOSS_SCATTERING = "loss_scattering";
    static final String LOSS_QUENCHING = "loss_quenching";
    static final String LOSS_COLLECTION = "loss_collection";
    static final String LOSS_REFLECTION = "loss_reflection";
    static final String LOSS_TRANSMISSION = "loss_transmission";
    static final String JSC_PLANAR = "jsc_planar";
    static final String ENHANCEMENT = "enhancement";
    static final String VOC = "voc";
    static final String FF = "ff";
    static final String EFFICIENCY = "efficiency";

    /** The output definitions, in output-vector order. */
    static List<OutputDef> definitions(boolean planarReference, boolean diode) {
        List<OutputDef> outs = new ArrayList<>();
        outs.add(new OutputDef(JSC, "mA/cm^2", "short-circuit current density collected (Hecht drift and dissociation)"));
        outs.add(new OutputDef(JSC_OPTICAL, "mA/cm^2", "current if every photon absorbed usefully in the absorber gave one electron"));
        outs.add(new OutputDef(ABSORPTANCE, "fraction", "photon-weighted share of the incident photons absorbed in the absorber"));
        outs.add(new OutputDef(LOSS_METAL, "mA/cm^2", "photons absorbed in the metal particles"));
        outs.add(new OutputDef(LOSS_ELECTRODES, "mA/cm^2", "photons absorbed in the electrodes"));
        outs.add(new OutputDef(LOSS_TRANSPORT, "mA/cm^2", "photons absorbed in transport and other non-absorber layers"));
        outs.add(new OutputDef(LOSS_SUBSTRATE, "mA/cm^2", "photons absorbed in the substrate"));
        outs.add(new OutputDef(LOSS_SCATTERING, "mA/cm^2", "scattered light that escapes or dies in the back electrode"));
        outs.add(new OutputDef(LOSS_QUENCHING, "mA/cm^2", "photons absorbed in the absorber within the quenching distance of a particle"));
        outs.add(new OutputDef(LOSS_COLLECTION, "mA/cm^2", "optical current lost to dissociation and charge collection"));
        outs.add(new OutputDef(LOSS_REFLECTION, "mA/cm^2", "photons reflected by the device"));
        outs.add(new OutputDef(LOSS_TRANSMISSION, "mA/cm^2", "photons transmitted through the device"));
        if (planarReference) {
            outs.add(new OutputDef(JSC_PLANAR, "mA/cm^2", "collected current of the same stack without particles"));
            outs.add(new OutputDef(ENHANCEMENT, "1", "jsc / jsc_planar"));
        }
        if (diode) {
            outs.add(new OutputDef(VOC, "V", "open-circuit voltage (one-diode model)"));
            outs.add(new OutputDef(FF, "fraction", "fill factor (one-diode model)"));
            outs.add(new OutputDef(EFFICIENCY, "fraction", "power conversion efficiency at 100 mW/cm^2"));
        }
        return Collections.unmodifiableList(outs);
    }

    /** The positions of the outputs in {@code defs}. */
    static OutputSlots of(List<OutputDef> defs) {
        return new OutputSlots(indexOf(defs, JSC), indexOf(defs, JSC_OPTICAL), indexOf(defs, ABSORPTANCE),
                indexOf(defs, LOSS_METAL), indexOf(defs, LOSS_ELECTRODES), indexOf(defs, LOSS_TRANSPORT),
                indexOf(defs, LOSS_SUBSTRATE), indexOf(defs, LOSS_SCATTERING), indexOf(defs, LOSS_QUENCHING),
                indexOf(defs, LOSS_COLLECTION), indexOf(defs, LOSS_REFLECTION), indexOf(defs, LOSS_TRANSMISSION),
                indexOf(defs, JSC_PLANAR), indexOf(defs, ENHANCEMENT), indexOf(defs, VOC), indexOf(defs, FF),
                indexOf(defs, EFFICIENCY));
    }

    private static int indexOf(List<OutputDef> outs, String id) {
        for (int i = 0; i < outs.size(); i++) {
            if (outs.get(i).id().equals(id)) {
                return i;
            }
        }
        return -1;
    }
}

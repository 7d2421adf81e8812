package org.fabspread.report;

import static org.fabspread.report.ReportText.*;
import static org.fabspread.report.ResultLookup.*;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.fabspread.device.DeviceModel;
import org.fabspread.device.Spectra;
import org.fabspread.model.OutputDef;
import org.fabspread.optics.PhotonBudget;
import org.fabspread.pipeline.StudyResults;
import org.fabspread.sampling.RunSummary;

/** The report's "Optics of the nominal device" section: where the light goes, generation, cross-sections, photon budget. */
final class OpticsSection {

    private final ChartFactory charts;

    OpticsSection(ChartFactory charts) {
        this.charts = charts;
    }

    Section section(StudyResults r) {
        Spectra s = r.nominalSpectra();
        List<Block> b = new ArrayList<>();
        int nw = s.size();
        Map<String, double[]> bands = new LinkedHashMap<>();
        if (any(s.substrateAbsorptance())) {
            String glass = r.study().stack().isEmpty() ? "substrate" : r.study().stack().get(0).name();
            bands.put(glass + " (substrate)", s.substrateAbsorptance());
        }
        for (Map.Entry<String, double[]> e : s.layerAbsorptance().entrySet()) {
            bands.put(e.getKey(), e.getValue());
        }
        if (r.study().particles() != null) {
            bands.put("particles: metal", s.particleMetal());
            double[] host = new double[nw];
            for (int i = 0; i < nw; i++) {
                host[i] = s.particleHost()[i] + s.particleQuenched()[i] + s.particleNearField()[i];
            }
            bands.put("particles: host and near field", host);
            bands.put("scattered light absorbed", s.diffuseAbsorbed());
        }
        String[] layers = bands.keySet().toArray(new String[0]);
        double[][] a = bands.values().toArray(new double[0][]);
        b.add(new Figure(charts.absorptionSpectra("absorption-spectra", "Where the light goes in the nominal device",
                        s.wavelengthNm(), layers, a, s.absorberEqe(), s.reflectance()),
                "Absorptance of each layer of the nominal device stacked in the order light meets them, with the "
                        + "absorber's external quantum efficiency and the reflectance (drawn down from 1); the gap "
                        + "between the top of the stack and the reflectance line is light transmitted or scattered "
                        + "out."));
        if (s.depthNm() != null && s.depthNm().length > 0 && any(s.generation())) {
            b.add(new Figure(charts.generationProfile("generation-profile", "Where the absorber generates carriers",
                            s.depthNm(), new String[] {"nominal device"}, new double[][] {s.generation()}, "cm⁻³ s⁻¹"),
                    "Photon-weighted absorption rate of the coherent field against depth in " + s.absorberName()
                            + " (diffuse light and the neighbour near field are not included)."));
        }
        DeviceModel.CrossSections cs = r.crossSections();
        if (cs != null) {
            b.add(new Figure(charts.crossSections("particle-cross-sections", "One nominal particle's cross-sections",
                            cs.wavelengthNm(), cs.extinction(), cs.scattering(), cs.absorption(), "nm²"),
                    "Ensemble-average cross-sections per particle at the nominal point (unpolarised light); "
                            + Numbers.num3(cs.numberPerArea() * 1e6) + " particles per µm²."));
        }
        List<List<String>> rows = new ArrayList<>();
        rows.add(List.of("incident photons on the grid", "every photon of the spectrum between "
                        + Numbers.num(s.wavelengthNm()[0]) + " and " + Numbers.num(s.wavelengthNm()[nw - 1]) + " nm",
                Numbers.num(PhotonBudget.incidentCurrent(s.photonFlux())), "–"));
        for (OutputDef od : r.outputs()) {
            if (!od.unit().equals("mA/cm^2")) {
                continue;
            }
            RunSummary.OutputStats st = statsOrNull(r.summary(), od.id());
            double nom = r.nominal(od.id());
            rows.add(List.of(od.id(), od.description(), Numbers.num(nom),
                    st == null ? "n/a" : Numbers.num(st.mean()) + " ± " + Numbers.num3(st.sd())));
        }
        b.add(Table.of("Photon budget as current density (mA/cm²)", List.of("output", "what it counts",
                "nominal device", "mean ± sd over the samples"), rows));
        return new Section(StudyReport.OPTICS, "Optics of the nominal device", b);
    }
}

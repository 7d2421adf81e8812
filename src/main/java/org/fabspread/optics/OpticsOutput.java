package org.fabspread.optics;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.nio.file.Path;
import java.util.Locale;

import org.fabspread.io.AtomicFiles;
import org.fabspread.study.Study;

/** Writes the nominal planar spectra of a study. */
public final class OpticsOutput {
    /** Name of the spectra file inside the output folder. */
    public static final String SPECTRA_FILE = "spectra.csv";

    private OpticsOutput() {
    }

    /**
     * Evaluates the nominal planar stack and writes {@code spectra.csv} into {@code outDir}: columns
     * {@code wavelength_nm,R,T}, then {@code A_<layer>} for every layer in stack order (the incoherent
     * substrate's column is its glass absorptance), then {@code eqe_<absorber>} for every absorber
     * layer at 100 % internal quantum efficiency.
     *
     * @return the optical-limit J_sc of the nominal stack, mA/cm²
     * @throws UncheckedIOException when the file cannot be written
     */
    public static double write(Study study, Path outDir) {
        PlanarOptics po = PlanarOptics.of(study);
        SpectralResult res = po.newResult();
        double jsc = po.evaluateNominal(res);
        LayerOptics lo = po.layerOptics();
        int layers = lo.layerCount();
        try {
            AtomicFiles.writeText(outDir.resolve(SPECTRA_FILE), w -> {
                w.write("wavelength_nm,R,T");
                for (int j = 0; j < layers; j++) {
                    w.write(",A_" + lo.layer(j).name());
                }
                for (int j = 0; j < layers; j++) {
                    if (lo.layer(j).isAbsorber()) {
                        w.write(",eqe_" + lo.layer(j).name());
                    }
                }
                w.write("\n");
                for (int i = 0; i < res.wavelengthCount(); i++) {
                    w.write(SolarSpectrum.fmt(res.wavelength(i)));
                    value(w, res.reflectance(i));
                    value(w, res.transmittance(i));
                    for (int j = 0; j < layers; j++) {
                        value(w, res.absorptance(j, i));
                    }
                    for (int j = 0; j < layers; j++) {
                        if (lo.layer(j).isAbsorber()) {
                            value(w, res.absorptance(j, i));
                        }
                    }
                    w.write("\n");
                }
            });
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write " + outDir.resolve(SPECTRA_FILE) + ": " + e.getMessage(), e);
        }
        return jsc;
    }

    private static void value(Writer w, double x) throws IOException {
        w.write(',');
        w.write(String.format(Locale.ROOT, "%.8f", x));
    }
}

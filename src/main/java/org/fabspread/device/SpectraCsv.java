package org.fabspread.device;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Locale;

import org.fabspread.io.AtomicFiles;
import org.fabspread.study.Layer;
import org.fabspread.study.Study;

/**
 * Writes a device's per-wavelength optics ({@link Spectra}) as CSV: wavelength, R, T, the absorptance
 * of every layer by name, the particle layer's shares, the diffuse light, the absorber's EQE at 100 %
 * internal quantum efficiency (every photon absorbed usefully gives an electron) and the collected EQE.
 * Every row sums to 1 over R, T and the absorbed and lost shares ({@link Spectra#closure(int)}).
 */
public final class SpectraCsv {

    private SpectraCsv() {
    }

    /** The header of the file for these spectra. */
    static String header(Spectra s) {
        StringBuilder sb = new StringBuilder("wavelength_nm,R,T");
        boolean substrate = false;
        for (double v : s.substrateAbsorptance()) {
            substrate |= v != 0;
        }
        if (substrate) {
            sb.append(",A_substrate");
        }
        for (String name : s.layerAbsorptance().keySet()) {
            sb.append(",A_").append(name);
        }
        sb.append(",A_particle_metal,A_particle_host,A_particle_quenched,A_particle_near_field")
                .append(",A_diffuse_in_absorber,scattering_lost,eqe_").append(s.absorberName())
                .append("_full_iqe,eqe_").append(s.absorberName()).append("_collected");
        return sb.toString();
    }

    /**
     * The absorber's useful absorptance at wavelength i: coherent absorption in the absorber layer(s)
     * plus the useful host part of the particle layer (when its host is an absorber), the near field
     * reaching the absorber and the diffuse light absorbed in it.
     */
    static double usefulAbsorptance(Spectra s, Study study, int i) {
        double a = 0;
        for (Layer l : study.stack()) {
            double[] al = s.layerAbsorptance().get(l.name());
            if (l.isAbsorber() && al != null) {
                a += al[i];
            }
        }
        boolean hostAbsorbs = study.particleLayer().map(p -> study.layer(p.host()).isAbsorber()).orElse(false);
        return a + s.particleNearField()[i] + s.diffuseAbsorbed()[i] + (hostAbsorbs ? s.particleHost()[i] : 0);
    }

    /** Writes the file atomically. */
    public static void write(Spectra s, Study study, Path file) throws IOException {
        boolean substrate = header(s).contains("A_substrate");
        StringBuilder sb = new StringBuilder(header(s)).append('\n');
        for (int i = 0; i < s.size(); i++) {
            sb.append(fmt(s.wavelengthNm()[i])).append(',').append(fmt(s.reflectance()[i])).append(',')
                    .append(fmt(s.transmittance()[i]));
            if (substrate) {
                sb.append(',').append(fmt(s.substrateAbsorptance()[i]));
            }
            for (double[] a : s.layerAbsorptance().values()) {
                sb.append(',').append(fmt(a[i]));
            }
            sb.append(',').append(fmt(s.particleMetal()[i])).append(',').append(fmt(s.particleHost()[i]))
                    .append(',').append(fmt(s.particleQuenched()[i])).append(',')
                    .append(fmt(s.particleNearField()[i])).append(',').append(fmt(s.diffuseAbsorbed()[i]))
                    .append(',').append(fmt(s.scatteringLost()[i])).append(',')
                    .append(fmt(usefulAbsorptance(s, study, i))).append(',')
                    .append(fmt(s.absorberEqe()[i])).append('\n');
        }
        AtomicFiles.writeString(file, sb.toString());
    }

    private static String fmt(double v) {
        return String.format(Locale.ROOT, "%.8g", v);
    }
}

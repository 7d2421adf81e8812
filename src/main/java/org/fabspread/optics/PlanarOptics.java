package org.fabspread.optics;

import org.fabspread.study.Layer;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;

/**
 * The optics of a study's planar stack (no particles) at normal incidence from air into air: an
 * optional incoherent first layer (the glass, {@link Layer#incoherent()}, by intensities:
 * {@link IncoherentSubstrate}) and coherent thin films behind it ({@link CoherentStack}). Each
 * coherent absorptance is scaled by the substrate entry factor. The optical-limit short-circuit
 * current counts one electron for every photon of the ASTM G173-03 global spectrum absorbed in the
 * absorber layer(s), with exact photon-flux bin integrals ({@link SolarSpectrum#photonFluxPerBin}).
 *
 * <p>The n, k tables are interpolated once ({@link LayerOptics}); an evaluation allocates nothing.
 * Not thread-safe: one instance per thread (construction is cheap once the {@link LayerOptics} and the
 * photon flux, both immutable, are shared).
 */
public final class PlanarOptics {
    private final LayerOptics optics;
    private final double[] flux;
    private final int layers;
    private final int nw;
    private final boolean substrate;
    private final int first;
    private final int coherent;
    private final boolean[] absorber;
    private final CoherentStack stack;
    private final double[][] nRe;
    private final double[][] nIm;
    private final double[] dCoherent;
    private final double[] kG;
    private final double[] nG;

    /**
     * @param optics the study's layer constants
     * @param photonFluxPerBin photons m^-2 s^-1 in each grid bin (same grid as {@code optics})
     */
    public PlanarOptics(LayerOptics optics, double[] photonFluxPerBin) {
        if (photonFluxPerBin.length != optics.wavelengthCount()) {
            throw new IllegalArgumentException("photon flux has " + photonFluxPerBin.length + " bins, the grid "
                    + optics.wavelengthCount());
        }
        this.optics = optics;
        this.flux = photonFluxPerBin.clone();
        this.layers = optics.layerCount();
        this.nw = optics.wavelengthCount();
        for (int j = 1; j < layers; j++) {
            if (optics.layer(j).incoherent()) {
                throw new StudyException("stack[" + j + "] (" + optics.layer(j).name()
                        + "): only the first layer (the substrate) may be incoherent");
            }
        }
        this.substrate = optics.layer(0).incoherent();
        this.first = substrate ? 1 : 0;
        this.coherent = layers - first;
        this.absorber = new boolean[layers];
        for (int j = 0; j < layers; j++) {
            absorber[j] = optics.layer(j).isAbsorber();
        }
        this.stack = new CoherentStack(coherent);
        this.nRe = new double[nw][coherent];
        this.nIm = new double[nw][coherent];
        this.dCoherent = new double[coherent];
        this.nG = new double[nw];
        this.kG = new double[nw];
    }

    /** Builds the layer constants and the AM1.5G photon flux of a study. */
    public static PlanarOptics of(Study study) {
        LayerOptics lo = LayerOptics.of(study);
        return new PlanarOptics(lo, SolarSpectrum.astmG173Global().photonFluxPerBin(study.grid()));
    }

    public LayerOptics layerOptics() {
        return optics;
    }

    /** Photon flux per bin, photons m^-2 s^-1 (a copy). */
    public double[] photonFlux() {
        return flux.clone();
    }

    /** A result object sized for this stack and grid (allocate once per thread). */
    public SpectralResult newResult() {
        return new SpectralResult(optics.wavelengths(), layers);
    }

    /** Nominal thicknesses of the stack's layers, nm. */
    public double[] nominalThicknesses() {
        double[] d = new double[layers];
        for (int j = 0; j < layers; j++) {
            d[j] = optics.layer(j).thickness().nominal();
        }
        return d;
    }

    /** Nominal n shifts (0 where the study gives none). */
    public double[] nominalShifts() {
        double[] s = new double[layers];
        for (int j = 0; j < layers; j++) {
            s[j] = LayerOptics.nominalShift(optics.layer(j));
        }
        return s;
    }

    /** Nominal k scales (1 where the study gives none). */
    public double[] nominalScales() {
        double[] s = new double[layers];
        for (int j = 0; j < layers; j++) {
            s[j] = LayerOptics.nominalScale(optics.layer(j));
        }
        return s;
    }

    /** The nominal stack. */
    public double evaluateNominal(SpectralResult out) {
        return evaluate(nominalThicknesses(), nominalShifts(), nominalScales(), out);
    }

    /**
     * Evaluates one sample of the stack over the whole grid.
     *
     * @param thicknessNm per stack layer, nm (the substrate's too)
     * @param nShift      per stack layer, added to n
     * @param kScale      per stack layer, multiplies k
     * @param out         filled with the spectra
     * @return the optical-limit J_sc of the absorber layer(s), mA/cm²
     */
    public double evaluate(double[] thicknessNm, double[] nShift, double[] kScale, SpectralResult out) {
        for (int j = first; j < layers; j++) {
            double d = thicknessNm[j];
            if (!(d >= 0)) {
                throw new IllegalArgumentException("layer " + optics.layer(j).name() + ": thickness " + d + " nm");
            }
            dCoherent[j - first] = d;
        }
        optics.applySample(first, nShift, kScale, nRe, nIm);
        if (substrate) {
            optics.applyLayer(0, nShift[0], kScale[0], nG, kG);
        }
        final double dGlass = substrate ? thicknessNm[0] : 0;
        double photons = 0;
        for (int i = 0; i < nw; i++) {
            final double lambda = optics.wavelength(i);
            double factor = 1;
            final double n0;
            if (substrate) {
                n0 = nG[i];
            } else {
                n0 = 1;
            }
            stack.solve(lambda, n0, coherent, nRe[i], nIm[i], dCoherent, 1.0, 0.0);
            final double rc = stack.reflectance();
            final double tc = stack.transmittance();
            if (substrate) {
                final double rAg = IncoherentSubstrate.fresnelNormal(1, 0, nG[i], kG[i]);
                final double tG = IncoherentSubstrate.singlePass(kG[i], dGlass, lambda);
                factor = IncoherentSubstrate.entryFactor(rAg, tG, rc);
                out.reflectance[i] = IncoherentSubstrate.totalReflectance(rAg, tG, rc);
                out.transmittance[i] = IncoherentSubstrate.totalTransmittance(rAg, tG, rc, tc);
                final double ag = IncoherentSubstrate.glassAbsorptance(rAg, tG, rc);
                out.glass[i] = ag;
                out.absorptance[0][i] = ag;
            } else {
                out.reflectance[i] = rc;
                out.transmittance[i] = tc;
                out.glass[i] = 0;
            }
            double eqe = 0;
            for (int j = first; j < layers; j++) {
                final double a = factor * stack.absorptance(j - first);
                out.absorptance[j][i] = a;
                if (absorber[j]) {
                    eqe += a;
                }
            }
            out.eqe[i] = eqe;
            photons += eqe * flux[i];
        }
        final double jsc = SolarSpectrum.toMilliampPerCm2(photons);
        out.jsc = jsc;
        return jsc;
    }
}

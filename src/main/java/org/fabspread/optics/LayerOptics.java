package org.fabspread.optics;

import java.util.List;

import org.fabspread.study.Layer;
import org.fabspread.study.Parameter;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;
import org.fabspread.study.WavelengthGrid;

/**
 * The nominal n and k of every layer of a study on the study's wavelength grid, interpolated once
 * ({@link NkTable#sample}) so that no solve ever interpolates. Immutable and thread-safe; per-sample
 * changes (an n shift, a k scale) are applied into caller-owned arrays by {@link #applyLayer} and
 * {@link #applySample}, which allocate nothing.
 */
public final class LayerOptics {
    private final List<Layer> layers;
    private final double[] wavelengths;
    private final double[][] n;
    private final double[][] k;
    private final String[] materials;

    private LayerOptics(List<Layer> layers, double[] wavelengths, double[][] n, double[][] k, String[] materials) {
        this.layers = layers;
        this.wavelengths = wavelengths;
        this.n = n;
        this.k = k;
        this.materials = materials;
    }

    /**
     * Resolves every layer's material and samples it on the study's grid.
     *
     * @throws StudyException naming the layer and the material when the grid leaves its table
     */
    public static LayerOptics of(Study study) {
        return of(study, MaterialLibrary.bundled());
    }

    /** As {@link #of(Study)} with a given library. */
    public static LayerOptics of(Study study, MaterialLibrary library) {
        WavelengthGrid grid = study.grid();
        double[] w = grid.wavelengths();
        List<Layer> stack = study.stack();
        if (stack.isEmpty()) {
            throw new StudyException(prefix(study) + "stack: the stack has no layers");
        }
        double lo = w[0];
        double hi = w[w.length - 1];
        double[][] n = new double[stack.size()][w.length];
        double[][] k = new double[stack.size()][w.length];
        String[] materials = new String[stack.size()];
        for (int j = 0; j < stack.size(); j++) {
            Layer layer = stack.get(j);
            NkTable table = library.resolve(layer.material());
            materials[j] = table.id();
            String where = prefix(study) + "stack[" + j + "] (" + layer.name() + "): material " + table.id()
                    + " is tabulated from " + SolarSpectrum.fmt(table.minWavelength()) + " to "
                    + SolarSpectrum.fmt(table.maxWavelength()) + " nm; ";
            if (!table.covers(lo)) {
                throw new StudyException(where + "the grid starts at " + SolarSpectrum.fmt(lo) + " nm");
            }
            if (!table.covers(hi)) {
                throw new StudyException(where + "the grid stops at " + SolarSpectrum.fmt(hi) + " nm");
            }
            table.sample(w, n[j], k[j]);
        }
        return new LayerOptics(stack, w, n, k, materials);
    }

    private static String prefix(Study study) {
        return study.file() == null ? "" : study.file().getFileName() + ": ";
    }

    /** Number of layers (the study's stack, in order). */
    public int layerCount() {
        return n.length;
    }

    /** Number of wavelengths of the grid. */
    public int wavelengthCount() {
        return wavelengths.length;
    }

    /** The grid's wavelengths, nm (a copy). */
    public double[] wavelengths() {
        return wavelengths.clone();
    }

    /** Wavelength i of the grid, nm. */
    public double wavelength(int i) {
        return wavelengths[i];
    }

    /** The study's layer j. */
    public Layer layer(int j) {
        return layers.get(j);
    }

    /** Resolved material id of layer j. */
    public String material(int j) {
        return materials[j];
    }

    /** Nominal n of layer j on the grid (a copy). */
    public double[] n(int layer) {
        return n[layer].clone();
    }

    /** Nominal k of layer j on the grid (a copy). */
    public double[] k(int layer) {
        return k[layer].clone();
    }

    /** Nominal n of layer j at wavelength index i. */
    public double n(int layer, int wavelengthIndex) {
        return n[layer][wavelengthIndex];
    }

    /** Nominal k of layer j at wavelength index i. */
    public double k(int layer, int wavelengthIndex) {
        return k[layer][wavelengthIndex];
    }

    /**
     * One layer's sampled constants over the grid: nOut[i] = n[i] + nShift, kOut[i] = k[i] · kScale.
     * Arrays indexed by wavelength, length ≥ {@link #wavelengthCount()}.
     */
    public void applyLayer(int layer, double nShift, double kScale, double[] nOut, double[] kOut) {
        final double[] nl = n[layer];
        final double[] kl = k[layer];
        for (int i = 0; i < nl.length; i++) {
            nOut[i] = nl[i] + nShift;
            kOut[i] = kl[i] * kScale;
        }
    }

    /**
     * Every layer's sampled constants, wavelength-major: nOut[i][j] = n_j(λ_i) + nShift[j],
     * kOut[i][j] = k_j(λ_i) · kScale[j], ready to hand to {@link CoherentStack#solve} per wavelength.
     * Layers from {@code firstLayer} on are written to columns 0, 1, … (skip an incoherent substrate with 1).
     */
    public void applySample(int firstLayer, double[] nShift, double[] kScale, double[][] nOut, double[][] kOut) {
        for (int j = firstLayer; j < n.length; j++) {
            final double[] nl = n[j];
            final double[] kl = k[j];
            final double sh = nShift[j];
            final double sc = kScale[j];
            final int col = j - firstLayer;
            for (int i = 0; i < nl.length; i++) {
                nOut[i][col] = nl[i] + sh;
                kOut[i][col] = kl[i] * sc;
            }
        }
    }

    /** Nominal n shift of a layer: its parameter's nominal value, 0 when the study leaves it out. */
    public static double nominalShift(Layer layer) {
        return nominal(layer.nShift(), 0.0);
    }

    /** Nominal k scale of a layer: its parameter's nominal value, 1 when the study leaves it out. */
    public static double nominalScale(Layer layer) {
        return nominal(layer.kScale(), 1.0);
    }

    private static double nominal(Parameter p, double dflt) {
        return p == null ? dflt : p.nominal();
    }
}

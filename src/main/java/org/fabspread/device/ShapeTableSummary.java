package org.fabspread.device;

import java.util.List;

/**
 * What a named particle shape's discrete-dipole table says about the nominal particle, and how well the
 * table holds: the extinction cross-section per in-plane polarisation at the nominal shape (the field along
 * the film's x axis, then along y), the wavelengths of their resonances, the tabulated shape parameters with
 * their ranges and node counts, and the leave-one-out interpolation error ({@code dda.InterpolationError}).
 *
 * <p>A shape with a mirror plane containing the film normal has its polarisability tensor diagonal in that
 * frame (Draine &amp; Flatau, J. Opt. Soc. Am. A 11, 1491 (1994), on symmetry of the dipole response), so
 * the two polarisations are the two independent responses; unpolarised light sees their mean.
 *
 * @param kind              the shape kind (crescent, rod, …)
 * @param parameters        ids of the tabulated (uncertain) shape parameters, e.g. {@code particles.shape.bite_offset}
 * @param low               lower end of each tabulated range, nm
 * @param high              upper end of each tabulated range, nm
 * @param nodes             nodes per tabulated parameter
 * @param tabulatedWavelengths number of wavelengths the solver ran at
 * @param parameterError    largest leave-one-out relative error of C_ext per tabulated parameter (NaN with fewer than 3 nodes)
 * @param wavelengthError   largest leave-one-out relative error of the wavelength interpolation (NaN with fewer than 5)
 * @param wavelengthNm      the study's wavelength grid
 * @param extinctionX       C_ext of the nominal particle with the field along x, nm²
 * @param extinctionY       C_ext of the nominal particle with the field along y, nm²
 */
public record ShapeTableSummary(String kind, List<String> parameters, double[] low, double[] high, int[] nodes,
                                int tabulatedWavelengths, double[] parameterError, double wavelengthError,
                                double[] wavelengthNm, double[] extinctionX, double[] extinctionY) {

    public ShapeTableSummary {
        parameters = List.copyOf(parameters);
        int k = parameters.size();
        if (low.length != k || high.length != k || nodes.length != k || parameterError.length != k) {
            throw new IllegalArgumentException("one range, node count and error per tabulated parameter");
        }
        if (extinctionX.length != wavelengthNm.length || extinctionY.length != wavelengthNm.length) {
            throw new IllegalArgumentException("one extinction value per wavelength and polarisation");
        }
        low = low.clone();
        high = high.clone();
        nodes = nodes.clone();
        parameterError = parameterError.clone();
        wavelengthNm = wavelengthNm.clone();
        extinctionX = extinctionX.clone();
        extinctionY = extinctionY.clone();
    }

    @Override
    public double[] low() {
        return low.clone();
    }

    @Override
    public double[] high() {
        return high.clone();
    }

    @Override
    public int[] nodes() {
        return nodes.clone();
    }

    @Override
    public double[] parameterError() {
        return parameterError.clone();
    }

    @Override
    public double[] wavelengthNm() {
        return wavelengthNm.clone();
    }

    @Override
    public double[] extinctionX() {
        return extinctionX.clone();
    }

    @Override
    public double[] extinctionY() {
        return extinctionY.clone();
    }

    /** Wavelength of the largest C_ext with the field along x, nm. */
    public double resonanceX() {
        return peak(extinctionX);
    }

    /** Wavelength of the largest C_ext with the field along y, nm. */
    public double resonanceY() {
        return peak(extinctionY);
    }

    /** The largest of the interpolation error estimates, or NaN when none could be made. */
    public double worstError() {
        double w = worse(Double.NaN, wavelengthError);
        for (double e : parameterError) {
            w = worse(w, e);
        }
        return w;
    }

    private static double worse(double w, double e) {
        return !Double.isNaN(e) && (Double.isNaN(w) || e > w) ? e : w;
    }

    /** Whether the peak sits on an end of the grid (the resonance may lie outside the study's range). */
    public boolean resonanceAtEdgeX() {
        return edge(extinctionX);
    }

    /** As {@link #resonanceAtEdgeX()} for the y polarisation. */
    public boolean resonanceAtEdgeY() {
        return edge(extinctionY);
    }

    private int argmax(double[] c) {
        int best = 0;
        for (int i = 1; i < c.length; i++) {
            if (c[i] > c[best]) {
                best = i;
            }
        }
        return best;
    }

    private double peak(double[] c) {
        return wavelengthNm[argmax(c)];
    }

    private boolean edge(double[] c) {
        int i = argmax(c);
        return i == 0 || i == c.length - 1;
    }
}

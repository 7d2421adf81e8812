package org.fabspread.optics;

/**
 * Reflectance, transmittance and layer absorptances of a coherent thin-film stack at oblique
 * incidence, for s (TE) or p (TM) polarisation: the characteristic-matrix method of Born &amp; Wolf,
 * <i>Principles of Optics</i>, ch. 1.6, in terms of tangential fields and tilted optical admittances
 * (Macleod, <i>Thin-Film Optical Filters</i>, ch. 2): in a medium of index N, with
 * q = N cos θ = sqrt(N² − n<sub>0</sub>² sin² θ<sub>0</sub>) (the branch with Im q ≥ 0, so waves decay
 * forward), the admittance is η = q for s and η = N²/q for p, and the phase thickness is 2πqd/λ.
 *
 * <p>Same conventions as {@link CoherentStack} (e<sup>−iωt</sup>, N = n + ik, real incident index
 * n<sub>0</sub>), which it reproduces at θ<sub>0</sub> = 0. Powers are normal components of the
 * Poynting vector, ½ Re(E<sub>t</sub> H<sub>t</sub>*), relative to the incident one; a layer's
 * absorptance is the difference of that flux across it. One instance per thread; {@link #solve}
 * allocates nothing.
 */
public final class ObliqueStack {
    /** Polarisation of the incident plane wave. */
    public enum Polarization {
        /** Electric field perpendicular to the plane of incidence (TE). */
        S,
        /** Electric field in the plane of incidence (TM). */
        P
    }

    private final int maxLayers;
    // tangential E and H at the front face of layer j (index count: the exit interface)
    private final double[] eRe;
    private final double[] eIm;
    private final double[] hRe;
    private final double[] hIm;
    private final int[] scaleExp;
    private final double[] absorbed;
    private final double[] adm = new double[4];
    private final FieldSweep sweep = new FieldSweep();
    private int count;
    private double reflectance;
    private double transmittance;
    private boolean solved;

    public ObliqueStack(int maxLayers) {
        if (maxLayers < 0) {
            throw new IllegalArgumentException("maxLayers must be >= 0, got " + maxLayers);
        }
        this.maxLayers = maxLayers;
        eRe = new double[maxLayers + 1];
        eIm = new double[maxLayers + 1];
        hRe = new double[maxLayers + 1];
        hIm = new double[maxLayers + 1];
        scaleExp = new int[maxLayers + 1];
        absorbed = new double[maxLayers];
    }

    /**
     * Solves the stack for one wavelength, angle and polarisation.
     *
     * @param thetaRad angle of incidence in the incident medium, radians, in [0, π/2)
     */
    public void solve(double lambdaNm, double n0, double thetaRad, Polarization pol, int count, double[] nRe,
                      double[] nIm, double[] dNm, double exitRe, double exitIm) {
        if (count > maxLayers || count < 0) {
            throw new IllegalArgumentException("layer count " + count + " outside 0.." + maxLayers);
        }
        if (!(thetaRad >= 0 && thetaRad < 0.5 * Math.PI) || !(n0 > 0) || !(lambdaNm > 0)) {
            throw new IllegalArgumentException("need 0 <= theta < pi/2, n0 > 0, lambda > 0");
        }
        this.count = count;
        final boolean p = pol == Polarization.P;
        final double k0 = 2 * Math.PI / lambdaNm;
        final double sin0 = n0 * Math.sin(thetaRad);
        final double beta2 = sin0 * sin0;        // (n0 sin θ0)²
        final double q0 = n0 * Math.cos(thetaRad);
        final double eta0 = p ? n0 * n0 / q0 : q0;

        // exit medium: unit forward tangential E, H = η_exit E
        final FieldSweep w = sweep;
        double[] tmp = admittance(exitRe, exitIm, beta2, p);
        w.start(tmp[2], tmp[3]);
        final double etaExitRe = tmp[2];
        eRe[count] = w.eRe;
        eIm[count] = w.eIm;
        hRe[count] = w.hRe;
        hIm[count] = w.hIm;
        scaleExp[count] = 0;
        for (int j = count - 1; j >= 0; j--) {
            // q = sqrt(N² − β²) with Im q ≥ 0
            final double[] a = admittance(nRe[j], nIm[j], beta2, p);
            final double th = k0 * a[0] * dNm[j];
            final double g = k0 * a[1] * dNm[j];
            w.cross(a[2], a[3], Math.cos(th), Math.sin(th), Math.exp(-g));
            eRe[j] = w.eRe;
            eIm[j] = w.eIm;
            hRe[j] = w.hRe;
            hIm[j] = w.hIm;
            scaleExp[j] = w.exp;
        }
        final int exp = w.exp;
        w.split(eta0);
        final double f0 = w.f0Re * w.f0Re + w.f0Im * w.f0Im;
        reflectance = (w.b0Re * w.b0Re + w.b0Im * w.b0Im) / f0;
        // flux at each interface, normalised to the incident flux η0 |F0|²
        double front = flux(0, exp, f0, eta0);
        for (int j = 0; j < count; j++) {
            double back = flux(j + 1, exp, f0, eta0);
            absorbed[j] = front - back;
            front = back;
        }
        double sc = FieldSweep.unscale(exp);
        transmittance = etaExitRe * sc * sc / (f0 * eta0);
        solved = true;
    }

    private double flux(int i, int exp, double f0, double eta0) {
        double sc = FieldSweep.unscale(exp - scaleExp[i]);
        return (eRe[i] * hRe[i] + eIm[i] * hIm[i]) * sc * sc / (f0 * eta0);
    }

    /** {Re q, Im q, Re η, Im η} of a medium; the returned array is this instance's scratch. */
    private double[] admittance(double nr, double ni, double beta2, boolean p) {
        // N² − β²
        final double n2r = nr * nr - ni * ni;
        final double n2i = 2 * nr * ni;
        final double zr = n2r - beta2;
        final double zi = n2i;
        // principal square root, then the branch with Im q ≥ 0 (Re q ≥ 0 when Im q = 0)
        final double mod = Math.hypot(zr, zi);
        double qr;
        double qi;
        // the stable form: take the root of the larger half, divide for the other (no cancellation)
        if (zr >= 0) {
            qr = Math.sqrt(0.5 * (mod + zr));
            qi = qr == 0 ? 0 : zi / (2 * qr);
        } else {
            qi = Math.copySign(Math.sqrt(0.5 * (mod - zr)), zi);
            qr = zi / (2 * qi);
        }
        if (qi < 0 || (qi == 0 && qr < 0)) {
            qr = -qr;
            qi = -qi;
        }
        adm[0] = qr;
        adm[1] = qi;
        if (p) {
            // η = N²/q
            final double inv = 1 / (qr * qr + qi * qi);
            adm[2] = (n2r * qr + n2i * qi) * inv;
            adm[3] = (n2i * qr - n2r * qi) * inv;
        } else {
            adm[2] = qr;
            adm[3] = qi;
        }
        return adm;
    }

    private void requireSolved() {
        if (!solved) {
            throw new IllegalStateException("solve() has not been called");
        }
    }

    public double reflectance() {
        requireSolved();
        return reflectance;
    }

    /** Power transmitted into the exit medium (0 beyond the critical angle). */
    public double transmittance() {
        requireSolved();
        return transmittance;
    }

    /** Fraction of the incident power absorbed in layer j. */
    public double absorptance(int j) {
        requireSolved();
        if (j < 0 || j >= count) {
            throw new IndexOutOfBoundsException("layer " + j + " outside 0.." + (count - 1));
        }
        return absorbed[j];
    }
}

package org.fabspread.particles;

/**
 * The optics of one particle (one quadrature node) at one wavelength, as {@link ExactSums} needs them:
 * the polarisability along the three axes, the metal's absorption, the scattering and its forward-hemisphere
 * part for the a and b polarisations, and the dipole's own metal absorption for the near-field budget.
 * Which theory gives which quantity is stated on {@link ExactSums}. A mutable scratch holder; allocation-free.
 */
final class NodeOptics {
    double aAr;
    double aAi;
    double aBr;
    double aBi;
    double aCr;
    double aCi;
    double absA;
    double absB;
    /** The metal absorption of the dipole term alone (internal dissipation), for {@link #hostBudget}. */
    double absDipA;
    double absDipB;
    double scaA;
    double scaB;
    double fwdA;
    double fwdB;
    private final MieSeries series = new MieSeries();
    private final double[] t = new double[2];

    /**
     * A sphere of radius r by the Mie series ({@code full}) or its electric dipole alone.
     *
     * @param invVolume 1/V (nm⁻³)
     */
    void sphere(double r, double invVolume, double lambdaNm, double er, double ei, double hRe, double hIm,
                boolean full) {
        double nh = ParticleEnsemble.indexRe(hRe, hIm);
        double k = 2 * Math.PI * nh / lambdaNm;
        double k3 = k * k * k;
        double sixPiK3 = 6 * Math.PI / k3;
        double scaK = k3 * k / (6 * Math.PI);
        double dR = er - hRe;
        double dI = ei - hIm;
        if (dR == 0 && dI == 0 || (hIm != 0 && dR == 0 && ei == 0)) {
            // a sphere matched to the host (or to its loss-free part): the general dipole routines
            Polarizability.mieDipole(r, lambdaNm, er, ei, hRe, hIm, t);
            setAlpha(t[0], t[1]);
            double ab = Polarizability.mieDipoleMetalAbsorption(r, lambdaNm, er, ei, hRe, hIm, t);
            double sc = scaK * (aAr * aAr + aAi * aAi);
            setLosses(ab, ab, sc, 0.5 * sc);
            return;
        }
        double h2 = hRe * hRe + hIm * hIm;
        double qRe = (er * hRe + ei * hIm) / h2;
        double qIm = (ei * hRe - er * hIm) / h2;
        double area = Math.PI * r * r;
        double x = k * r;
        // a sphere beyond the series' reach (x ≳ 140: tens of µm, far outside any film; in practice only the
        // far tail of a wide quadrature rule, with a negligible weight) keeps the dipole alone
        full = full && MieSeries.terms(Math.max(x, 2 * Math.PI * ParticleEnsemble.indexRe(hRe, 0) / lambdaNm * r))
                <= MieSeries.MAX_TERMS;
        double sca;
        double fwd;
        double absReal;
        if (full) {
            Mie.sqrt(qRe, qIm, t);
            series.compute(t[0], t[1], x);
            setAlpha(-sixPiK3 * series.aIm(1), sixPiK3 * series.aRe(1));
            sca = area * series.qSca();
            fwd = area * series.qForward();
            absReal = area * series.qAbs();
        } else {
            Mie.a1OfSquare(qRe, qIm, x, t);
            setAlpha(-sixPiK3 * t[1], sixPiK3 * t[0]);
            sca = scaK * (aAr * aAr + aAi * aAi);
            fwd = 0.5 * sca;
            absReal = k * aAi - sca;
        }
        double al2 = aAr * aAr + aAi * aAi;
        double twoPiLam = 2 * Math.PI / lambdaNm;
        double intAbs = twoPiLam * ei * h2 * al2 * invVolume / ((dR * dR + dI * dI) * nh);
        double metal;
        if (hIm == 0) {
            metal = Math.max(0, absReal);
        } else {
            // the same sphere in the loss-free host (Re ε_h, 0), with that host's own wavenumber k₀
            double n0 = ParticleEnsemble.indexRe(hRe, 0);
            double k0 = 2 * Math.PI * n0 / lambdaNm;
            double x0 = k0 * r;
            double sixPiK03 = 6 * Math.PI / (k0 * k0 * k0);
            double b0r;
            double b0i;
            double loss0;
            if (full) {
                Mie.sqrt(er / hRe, ei / hRe, t);
                series.compute(t[0], t[1], x0);
                b0r = -sixPiK03 * series.aIm(1);
                b0i = sixPiK03 * series.aRe(1);
                loss0 = area * series.qAbs();
            } else {
                Mie.a1OfSquare(er / hRe, ei / hRe, x0, t);
                b0r = -sixPiK03 * t[1];
                b0i = sixPiK03 * t[0];
                double k04 = k0 * k0 * k0 * k0;
                loss0 = k0 * b0i - k04 / (6 * Math.PI) * (b0r * b0r + b0i * b0i);
            }
            double b2 = b0r * b0r + b0i * b0i;
            double intReal = twoPiLam * ei * hRe * hRe * b2 * invVolume / ((dR * dR + ei * ei) * n0);
            metal = !(intReal > 0) ? intAbs : intAbs * Math.max(0, loss0) / intReal;
        }
        absA = metal;
        absB = metal;
        absDipA = hIm == 0 ? Math.max(0, k * aAi - scaK * al2) : intAbs;
        absDipB = absDipA;
        scaA = sca;
        scaB = sca;
        fwdA = fwd;
        fwdB = fwd;
    }

    private void setAlpha(double re, double im) {
        aAr = re;
        aAi = im;
        aBr = re;
        aBi = im;
        aCr = re;
        aCi = im;
    }

    private void setLosses(double ab, double dip, double sc, double fw) {
        absA = ab;
        absB = ab;
        absDipA = dip;
        absDipB = dip;
        scaA = sc;
        scaB = sc;
        fwdA = fw;
        fwdB = fw;
    }

    /**
     * An ellipsoid (node i) by the quasi-static polarisability, with the MLWA corrections when c3, k2 ≠ 0:
     * 1/α_j = (u + L_j)/V − k²/(4π a_j) − i k³/(6π), u = ε_h/(ε − ε_h); σ_abs,metal from the internal field
     * |ε_h|²|α|²/(V²|ε − ε_h|²) (Polarizability.metalAbsorption); σ_sca = k⁴|α|²/(6π), half of it forward.
     */
    void ellipsoid(int i, EnsembleNodes nodes, double lA, double lB, double lC, double c3, double k2,
                   double twoPiLam, double scaK, double er, double ei, double hRe, double hIm, double h2, double nh) {
        double dR = er - hRe;
        double dI = ei - hIm;
        double v = nodes.volume[i];
        if (dR == 0 && dI == 0) {
            // inclusion matched to the host: α = 0 (Polarizability.metalAbsorption's |α'/α| = 1 branch)
            setAlpha(0, 0);
            double mA = Polarizability.metalAbsorption(twoPiLamToLambda(twoPiLam), v, lA, er, ei, hRe, hIm, 0, 0, 0, 0);
            double mB = Polarizability.metalAbsorption(twoPiLamToLambda(twoPiLam), v, lB, er, ei, hRe, hIm, 0, 0, 0, 0);
            absA = mA;
            absB = mB;
            absDipA = mA;
            absDipB = mB;
            scaA = 0;
            scaB = 0;
            fwdA = 0;
            fwdB = 0;
            return;
        }
        double d2 = dR * dR + dI * dI;
        double ur = (hRe * dR + hIm * dI) / d2;
        double ui = (hIm * dR - hRe * dI) / d2;
        double iv = nodes.invVolume[i];
        double pi = ui * iv;
        int o = 3 * i;
        double cA = k2 * nodes.invFourPiAxis[o];
        double cB = k2 * nodes.invFourPiAxis[o + 1];
        double cC = k2 * nodes.invFourPiAxis[o + 2];
        double qi = pi - c3;
        double pr = (ur + lA) * iv - cA;
        double inv = 1 / (pr * pr + qi * qi);
        aAr = pr * inv;
        aAi = -qi * inv;
        pr = (ur + lB) * iv - cB;
        inv = 1 / (pr * pr + qi * qi);
        aBr = pr * inv;
        aBi = -qi * inv;
        pr = (ur + lC) * iv - cC;
        inv = 1 / (pr * pr + qi * qi);
        aCr = pr * inv;
        aCi = -qi * inv;
        double f = twoPiLam * ei * h2 * iv / (d2 * nh);
        double a2 = aAr * aAr + aAi * aAi;
        double b2 = aBr * aBr + aBi * aBi;
        absA = f * a2;
        absB = f * b2;
        absDipA = absA;
        absDipB = absB;
        scaA = scaK * a2;
        scaB = scaK * b2;
        fwdA = 0.5 * scaA;
        fwdB = 0.5 * scaB;
    }

    private static double twoPiLamToLambda(double twoPiLam) {
        return 2 * Math.PI / twoPiLam;
    }

    /**
     * The most the near field may give the host, in the units of the near-field integral |α|² I_host (nm³):
     * B/κ_h with B = max(0, σ_rem − σ_abs,dip − σ_sca,dip) + κ_h V and σ_rem = (2π/λ) Im(ε_h α)/Re n_h
     * (see {@link ExactSums}).
     */
    double hostBudget(double ar, double ai, double absDip, double hRe, double hIm, double twoPiLam, double nh,
                      double scaK, double kappa, double volume) {
        double removed = twoPiLam * (hRe * ai + hIm * ar) / nh;
        double left = removed - absDip - scaK * (ar * ar + ai * ai);
        return Math.max(0, left) / kappa + volume;
    }
}

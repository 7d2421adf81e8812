package org.fabspread.particles;

/**
 * The exact path of {@link ParticleEnsemble}: the single-particle quantities computed node by node at one
 * wavelength (size-corrected permittivity, polarisability by the chosen method, the metal's internal
 * dissipation) and summed into the ensemble averages.
 */
final class ExactSums {
    private ExactSums() {
    }

    /**
     * Sums over the nodes at one wavelength into {@code out}. Allocation-free.
     *
     * @param mie  Mie electric dipole (spheres)
     * @param mlwa modified long-wavelength approximation (else quasi-static when not mie)
     */
    static void sum(EnsembleNodes nodes, NearFieldIntegrals near, boolean mie, boolean mlwa, double lambdaNm,
                    double epsRe, double epsIm, double hRe, double hIm, EnsembleAverages out) {
        double nh = ParticleEnsemble.indexRe(hRe, hIm);
        // everything that depends on the wavelength only
                double k = 2 * Math.PI * nh / lambdaNm;
        double k2 = k * k;
        double c3 = k2 * k / (6 * Math.PI);
        double scaK = k2 * k2 / (6 * Math.PI);
        double sixPiK3 = 6 * Math.PI / (k2 * k);
        double twoPiLam = 2 * Math.PI / lambdaNm;
        double e = MetalPermittivity.photonEnergyEv(lambdaNm);
        double e2 = e * e;
        double h2 = hRe * hRe + hIm * hIm;
        double invHRe = hRe / h2;
        double invHIm = -hIm / h2;
        // the loss-free host (Re ε_h, 0) of the Mie dipole's absorption in an absorbing host
        double n0 = ParticleEnsemble.indexRe(hRe, 0);
        double k0 = 2 * Math.PI * n0 / lambdaNm;
        double sixPiK03 = 6 * Math.PI / (k0 * k0 * k0);
        final double[] depol = nodes.depol;
        final double[] weight = nodes.weight;
        final double[] radius = nodes.radius;
        final double[] invVolume = nodes.invVolume;
        final double[] invFourPiAxis = nodes.invFourPiAxis;
        final double[] invR3 = nodes.invR3;
        final double[] invZ3 = near.invZ3;
        final double[] hostNear16 = near.hostNear16;
        final double[] quenchNear16 = near.quenchNear16;
        final boolean sizeCorrection = nodes.sizeCorrection;
        double lA = depol[0];
        double lB = depol[1];
        double lC = depol[2];
        double sAr = 0;
        double sAi = 0;
        double sBr = 0;
        double sBi = 0;
        double sCr = 0;
        double sCi = 0;
        double absA = 0;
        double absB = 0;
        double a2A = 0;
        double a2B = 0;
        double r3A = 0;
        double r3B = 0;
        double z3A = 0;
        double z3B = 0;
        double hostA = 0;
        double hostB = 0;
        double qA = 0;
        double qB = 0;
        double[] t = out.tmp;
        for (int i = 0; i < nodes.active; i++) {
            double w = weight[i];
            double r = radius[i];
            double er = epsRe;
            double ei = epsIm;
            if (sizeCorrection) {
                // MetalPermittivity.sizeCorrected with its wavelength-free terms taken from the node
                double dr = e * (e2 - nodes.dampProd[i]);
                double di = e2 * nodes.dampSum[i];
                double den = dr * dr + di * di;
                er = epsRe + nodes.dampNum[i] * di / den;
                ei = epsIm + nodes.dampNum[i] * dr / den;
            }
            double dR = er - hRe;
            double dI = ei - hIm;
            double aAr;
            double aAi;
            double aBr;
            double aBi;
            double aCr;
            double aCi;
            double mA;
            double mB;
            if (mie) {
                if ((dR == 0 && dI == 0) || (hIm != 0 && dR == 0 && ei == 0)) {
                    // a sphere matched to the host (or to its loss-free part): the general routines
                    Polarizability.mieDipole(r, lambdaNm, er, ei, hRe, hIm, t);
                    aAr = t[0];
                    aAi = t[1];
                    mA = Polarizability.mieDipoleMetalAbsorption(r, lambdaNm, er, ei, hRe, hIm, t);
                } else {
                    // α = 6π i a_1/k³, m² = ε/ε_h, x = k r
                    Mie.a1OfSquare(er * invHRe - ei * invHIm, er * invHIm + ei * invHRe, k * r, t);
                    aAr = -sixPiK3 * t[1];
                    aAi = sixPiK3 * t[0];
                    double al2 = aAr * aAr + aAi * aAi;
                    if (hIm == 0) {
                        mA = Math.max(0, k * aAi - scaK * al2);
                    } else {
                        // Polarizability.mieDipoleMetalAbsorption: internal dissipation in the absorbing host,
                        // rescaled by exact / internal dissipation of the same sphere in (Re ε_h, 0); the
                        // quasi-static field factor and |α_static|² cancel to |ε_h|²|α|²/(V²|ε − ε_h|²)
                        Mie.a1OfSquare(er / hRe, ei / hRe, k0 * r, t);
                        double b0r = -sixPiK03 * t[1];
                        double b0i = sixPiK03 * t[0];
                        double b2 = b0r * b0r + b0i * b0i;
                        double exact = k * b0i - scaK * b2;
                        double iv = invVolume[i];
                        double intReal = twoPiLam * ei * hRe * hRe * b2 * iv / ((dR * dR + ei * ei) * n0);
                        double intAbs = twoPiLam * ei * h2 * al2 * iv / ((dR * dR + dI * dI) * nh);
                        mA = !(intReal > 0) ? intAbs : intAbs * Math.max(0, exact) / intReal;
                    }
                }
                aBr = aAr;
                aBi = aAi;
                aCr = aAr;
                aCi = aAi;
                mB = mA;
            } else if (dR == 0 && dI == 0) {
                // inclusion matched to the host: α = 0 (Polarizability.metalAbsorption's |α'/α| = 1 branch)
                aAr = 0;
                aAi = 0;
                aBr = 0;
                aBi = 0;
                aCr = 0;
                aCi = 0;
                mA = Polarizability.metalAbsorption(lambdaNm, nodes.volume[i], lA, er, ei, hRe, hIm, 0, 0, 0, 0);
                mB = Polarizability.metalAbsorption(lambdaNm, nodes.volume[i], lB, er, ei, hRe, hIm, 0, 0, 0, 0);
            } else {
                // 1/α_j = (u + L_j)/V with u = ε_h/(ε − ε_h); MLWA: α'_j = 1/(1/α_j − k²/(4π a_j) − i k³/(6π))
                double d2 = dR * dR + dI * dI;
                double ur = (hRe * dR + hIm * dI) / d2;
                double ui = (hIm * dR - hRe * dI) / d2;
                double iv = invVolume[i];
                double pi = ui * iv;
                double ci = 0;
                double cA = 0;
                double cB = 0;
                double cC = 0;
                if (mlwa) {
                    int o = 3 * i;
                    ci = c3;
                    cA = k2 * invFourPiAxis[o];
                    cB = k2 * invFourPiAxis[o + 1];
                    cC = k2 * invFourPiAxis[o + 2];
                }
                double qi = pi - ci;
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
                // Polarizability.metalAbsorption: field factor |ε_h/(ε_h + L(ε − ε_h))|² times |α'/α|² is
                // |ε_h|²|α'|²/(V²|ε − ε_h|²)
                double f = twoPiLam * ei * h2 * iv / (d2 * nh);
                mA = f * (aAr * aAr + aAi * aAi);
                mB = f * (aBr * aBr + aBi * aBi);
            }
            sAr += w * aAr;
            sAi += w * aAi;
            sBr += w * aBr;
            sBi += w * aBi;
            sCr += w * aCr;
            sCi += w * aCi;
            absA += w * mA;
            absB += w * mB;
            double wa = w * (aAr * aAr + aAi * aAi);
            double wb = w * (aBr * aBr + aBi * aBi);
            a2A += wa;
            a2B += wb;
            double ir3 = invR3[i];
            r3A += wa * ir3;
            r3B += wb * ir3;
            double iz3 = invZ3[i];
            z3A += wa * iz3;
            z3B += wb * iz3;
            double hn = hostNear16[i];
            hostA += wa * hn;
            hostB += wb * hn;
            double qn = quenchNear16[i];
            qA += wa * qn;
            qB += wb * qn;
        }
        out.alphaRe[0] = sAr;
        out.alphaIm[0] = sAi;
        out.alphaRe[1] = sBr;
        out.alphaIm[1] = sBi;
        out.alphaRe[2] = sCr;
        out.alphaIm[2] = sCi;
        EnsembleAverages.set(out.absMetal, absA, absB);
        EnsembleAverages.set(out.sca, scaK * a2A, scaK * a2B);
        EnsembleAverages.set(out.a2r3, r3A, r3B);
        EnsembleAverages.set(out.a2z3, z3A, z3B);
        double nb = 1 / (64 * Math.PI);
        EnsembleAverages.set(out.nearNeighbour, nb * z3A, nb * z3B);
        EnsembleAverages.set(out.nearHost, hostA, hostB);
        EnsembleAverages.set(out.nearQuench, qA, qB);
        out.shellHost = near.shellSum;
    }
}

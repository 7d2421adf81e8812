package org.fabspread.particles;

/**
 * The exact path of {@link ParticleEnsemble}: the single-particle quantities computed node by node at one
 * wavelength and summed into the ensemble averages.
 *
 * <p>Per node: the size-corrected permittivity ({@link MetalPermittivity}), then by method
 * <ul>
 *   <li>{@link Polarizability.Method#MIE} (spheres, the default): the full series ({@link MieSeries}) with
 *       m = √(ε/ε_h), x = k r, k = 2π Re n_h/λ. The polarisability the effective medium uses is the electric
 *       dipole α = 6π i a_1/k³ (extended Maxwell Garnett, Doyle, Phys. Rev. B 39, 9852 (1989); Ruppin, Opt.
 *       Commun. 182, 273 (2000)); the loss and scattering budget uses every order: σ_sca = πr² Q_sca, the
 *       forward-hemisphere part πr² Q_fwd, and in a real host σ_abs,metal = πr²(Q_ext − Q_sca).</li>
 *   <li>{@link Polarizability.Method#MIE_DIPOLE}: the n = 1 electric term alone for all of them (σ_sca =
 *       k⁴|α|²/(6π), half of it forward).</li>
 *   <li>MLWA or quasi-static (any ellipsoid): α per axis, σ_sca = k⁴|α|²/(6π), half forward, σ_abs,metal from
 *       the internal field.</li>
 * </ul>
 * In an absorbing host (Im ε_h &gt; 0) the sphere's metal absorption comes from its internal field (model
 * document §4.2): the loss of the same sphere in the loss-free host (Re ε_h, 0) — computed there with that
 * host's own wavenumber k₀ = 2π √(Re ε_h)/λ, by the full series or the dipole as above — times the ratio of
 * the internal dissipation (2π/λ) V Im ε |ε_h|² |α|² / (V² |ε − ε_h|² Re n_h) in the absorbing host to the
 * same in the loss-free host (the quasi-static internal field rescaled by the radiative factor |α/α_qs|²).
 *
 * <p>Near field in an absorbing host, bounded by the energy the particle removes: the work the incident
 * field does on the dipole, σ_rem = (2π/λ) Im(ε_h α)/Re n_h (Poynting's theorem for a dipole, Jackson,
 * <i>Classical Electrodynamics</i>, 3rd ed., §6.7 and §9.2; k Im α in a real host), goes into the metal, into
 * radiation and into the surrounding host; with the host volume the particle displaces (κ_h V) returned, the
 * host's share of it is at most B = max(0, σ_rem − σ_abs,dip − σ_sca,dip) + κ_h V. Each node's near-field
 * host integral κ_h |α|² I_host is capped at B, so no particle hands the host more than it took from the
 * field (the point-dipole field grows without bound near resonance; the cap is what keeps a dense layer of
 * resonant particles from creating light).
 */
final class ExactSums {
    private ExactSums() {
    }

    /**
     * Sums over the nodes at one wavelength into {@code out}. Allocation-free.
     *
     * @param m the method in effect (AUTO resolved)
     */
    static void sum(EnsembleNodes nodes, NearFieldIntegrals near, Polarizability.Method m, double lambdaNm,
                    double epsRe, double epsIm, double hRe, double hIm, EnsembleAverages out) {
        double nh = ParticleEnsemble.indexRe(hRe, hIm);
        boolean sphereMie = m == Polarizability.Method.MIE || m == Polarizability.Method.MIE_DIPOLE;
        boolean full = m == Polarizability.Method.MIE;
        boolean mlwa = m == Polarizability.Method.MLWA;
        double k = 2 * Math.PI * nh / lambdaNm;
        double k2 = k * k;
        double c3 = k2 * k / (6 * Math.PI);
        double scaK = k2 * k2 / (6 * Math.PI);
        double twoPiLam = 2 * Math.PI / lambdaNm;
        double kappa = twoPiLam * hIm / nh;
        double e = MetalPermittivity.photonEnergyEv(lambdaNm);
        double e2 = e * e;
        double h2 = hRe * hRe + hIm * hIm;
        final double[] depol = nodes.depol;
        final double[] weight = nodes.weight;
        final double[] invR3 = nodes.invR3;
        final double[] invZ3 = near.invZ3;
        final double[] hostNear16 = near.hostNear16;
        final double[] quenchNear16 = near.quenchNear16;
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
        double scaA = 0;
        double scaB = 0;
        double fwdA = 0;
        double fwdB = 0;
        double r3A = 0;
        double r3B = 0;
        double z3A = 0;
        double z3B = 0;
        double hostA = 0;
        double hostB = 0;
        double qA = 0;
        double qB = 0;
        double capSum = 0;
        NodeOptics p = out.node;
        for (int i = 0; i < nodes.active; i++) {
            double w = weight[i];
            double er = epsRe;
            double ei = epsIm;
            if (nodes.sizeCorrection) {
                // MetalPermittivity.sizeCorrected with its wavelength-free terms taken from the node
                double dr = e * (e2 - nodes.dampProd[i]);
                double di = e2 * nodes.dampSum[i];
                double den = dr * dr + di * di;
                er = epsRe + nodes.dampNum[i] * di / den;
                ei = epsIm + nodes.dampNum[i] * dr / den;
            }
            if (sphereMie) {
                p.sphere(nodes.radius[i], nodes.invVolume[i], lambdaNm, er, ei, hRe, hIm, full);
            } else {
                p.ellipsoid(i, nodes, lA, lB, lC, mlwa ? c3 : 0, mlwa ? k2 : 0, twoPiLam, scaK, er, ei, hRe, hIm, h2,
                        nh);
            }
            sAr += w * p.aAr;
            sAi += w * p.aAi;
            sBr += w * p.aBr;
            sBi += w * p.aBi;
            sCr += w * p.aCr;
            sCi += w * p.aCi;
            absA += w * p.absA;
            absB += w * p.absB;
            scaA += w * p.scaA;
            scaB += w * p.scaB;
            fwdA += w * p.fwdA;
            fwdB += w * p.fwdB;
            double wa = w * (p.aAr * p.aAr + p.aAi * p.aAi);
            double wb = w * (p.aBr * p.aBr + p.aBi * p.aBi);
            double ir3 = invR3[i];
            r3A += wa * ir3;
            r3B += wb * ir3;
            double iz3 = invZ3[i];
            z3A += wa * iz3;
            z3B += wb * iz3;
            double hn = hostNear16[i];
            double qn = quenchNear16[i];
            double hA = wa * hn;
            double hB = wb * hn;
            if (kappa > 0) {
                // the near field's host share may not exceed what the particle removes from the field
                double capA = w * p.hostBudget(p.aAr, p.aAi, p.absDipA, hRe, hIm, twoPiLam, nh, scaK, kappa,
                        nodes.volume[i]);
                double capB = w * p.hostBudget(p.aBr, p.aBi, p.absDipB, hRe, hIm, twoPiLam, nh, scaK, kappa,
                        nodes.volume[i]);
                capSum += capA;
                double fA = hA > capA ? capA / hA : 1;
                double fB = hB > capB ? capB / hB : 1;
                hA *= fA;
                hB *= fB;
                qA += fA * wa * qn;
                qB += fB * wb * qn;
            } else {
                qA += wa * qn;
                qB += wb * qn;
            }
            hostA += hA;
            hostB += hB;
        }
        out.alphaRe[0] = sAr;
        out.alphaIm[0] = sAi;
        out.alphaRe[1] = sBr;
        out.alphaIm[1] = sBi;
        out.alphaRe[2] = sCr;
        out.alphaIm[2] = sCi;
        EnsembleAverages.set(out.absMetal, absA, absB);
        EnsembleAverages.set(out.sca, scaA, scaB);
        EnsembleAverages.set(out.fwd, fwdA, fwdB);
        EnsembleAverages.set(out.a2r3, r3A, r3B);
        EnsembleAverages.set(out.a2z3, z3A, z3B);
        double nb = 1 / (64 * Math.PI);
        EnsembleAverages.set(out.nearNeighbour, nb * z3A, nb * z3B);
        EnsembleAverages.set(out.nearHost, hostA, hostB);
        EnsembleAverages.set(out.nearQuench, qA, qB);
        out.shellHost = near.shellSum;
        out.hostCap = kappa > 0 ? capSum : Double.POSITIVE_INFINITY;
    }
}

package org.fabspread.particles;

/**
 * The particles of one device: a lognormal spread of sizes at fixed shape, averaged by Gauss–Hermite
 * quadrature, with the per-wavelength ensemble averages the effective medium and the loss split need.
 *
 * <p>Size and shape (see {@code study.ParticleLayer}): the volume-equivalent diameter D is lognormal
 * with median D₅₀ and coefficient of variation CV, σ_ln = √(ln(1 + CV²)); node i has
 * D_i = D₅₀ exp(√2 σ_ln x_i) and weight w_i/√π (Gauss–Hermite, 12 nodes by default). Semi-axes
 * a = (D/2)(p/q)^{1/3}, b = a/p, c = q a with in-plane aspect p = a/b ≥ 1 and out-of-plane aspect
 * q = c/a; a and b lie in the film plane. Coverage θ is the fraction of the area covered by particle
 * projections: n_A = θ/(π⟨ab⟩); the layer is as thick as the median particle is high, h = 2c(D₅₀);
 * n_V = n_A/h and f = n_A⟨V⟩/h.
 *
 * <p>Every ensemble quantity is the weighted average of the per-particle quantity (never a ratio of
 * averages). Per node the bulk permittivity is size-corrected with that node's ℓ = 4V/S
 * ({@link MetalPermittivity}), the quasi-static polarisability is corrected by the chosen
 * {@link Polarizability.Method}, and the metal's absorption is its internal dissipation.
 *
 * <p>Near field (model: quasi-static dipole outside the volume-equivalent sphere r_eq = D/2, in-plane
 * dipole, |E/E₀|² = |α|²(1 + 3cos²ψ)/(16π² r⁶)): over r &gt; r_eq it integrates to |α|²/(6π r_eq³); over the
 * half-space beyond a plane at distance z₀ ≥ r_eq from the centre to |α|²/(64π z₀³); the quenching shell
 * r_eq &lt; r &lt; r_eq + δ_q keeps its part on the host side of that plane.
 *
 * <p>Parts, one concept per file: the quadrature nodes and layer geometry ({@code EnsembleNodes}), the
 * near-field integrals ({@code NearFieldIntegrals}), the exact per-node path ({@code ExactSums}), the
 * tabulated path ({@code TabulatedSums} over a {@link DipoleTable}) and the averages they fill
 * ({@code EnsembleAverages}).
 *
 * <p>Not thread-safe: one instance per thread. {@link #compute} allocates nothing.
 */
public final class ParticleEnsemble {
    /** Default number of Gauss–Hermite nodes. */
    public static final int DEFAULT_NODES = 12;
    /** Index of the in-plane axis a (also polarisation along a). */
    public static final int AXIS_A = 0;
    /** Index of the in-plane axis b. */
    public static final int AXIS_B = 1;
    /** Index of the out-of-plane axis c. */
    public static final int AXIS_C = 2;
    /** Polarisation index: unpolarised light at normal incidence, the average of the a and b polarisations. */
    public static final int UNPOLARIZED = 2;

    private final EnsembleNodes nodes;
    private final NearFieldIntegrals near;
    private final TabulatedSums tab;
    private boolean shapeSet;

    private double plasmaEv;
    private double dampingEv;
    private double fermiVelocity;
    private double surfaceA;
    private Polarizability.Method method = Polarizability.Method.AUTO;

    private boolean computed;
    private double lambda;
    private double hostRe;
    private double hostIm;
    private double hostIndex;
    private double z0;
    private double quench;
    private final EnsembleAverages avg = new EnsembleAverages();

    /** Scratch for the default 12-node rule. */
    public ParticleEnsemble() {
        this(DEFAULT_NODES);
    }

    /** Scratch for a rule with {@code nodes} Gauss–Hermite nodes (one instance per thread). */
    public ParticleEnsemble(int nodes) {
        this.nodes = new EnsembleNodes(nodes);
        this.near = new NearFieldIntegrals(nodes);
        this.tab = new TabulatedSums(nodes);
        setMetal(0, 0, 0, 0);
    }

    /**
     * Sets size and shape (once per sample). Allocation-free.
     *
     * @param medianDiameterNm D₅₀ of the volume-equivalent diameter (nm)
     * @param sizeCv           CV of D (0 = one size)
     * @param inPlaneAspect    p = a/b ≥ 1
     * @param outOfPlaneAspect q = c/a &gt; 0
     * @param coverageFraction θ, 0 ≤ θ ≤ 1
     */
    public ParticleEnsemble setShape(double medianDiameterNm, double sizeCv, double inPlaneAspect,
                                     double outOfPlaneAspect, double coverageFraction) {
        checkShape(medianDiameterNm, sizeCv, inPlaneAspect, outOfPlaneAspect, coverageFraction);
        nodes.setShape(medianDiameterNm, sizeCv, inPlaneAspect, outOfPlaneAspect, coverageFraction);
        shapeSet = true;
        computed = false;
        near.invalidate();
        tab.clear();
        nodes.prepareDamping(plasmaEv, dampingEv, fermiVelocity, surfaceA);
        return this;
    }

    /**
     * Free-electron parameters for the size correction (Kreibig &amp; Vollmer 1995). A_s = 0 (the default)
     * uses the bulk permittivity unchanged.
     */
    public ParticleEnsemble setMetal(double plasmaEnergyEv, double bulkDampingEv, double fermiVelocityMs,
                                     double surfaceScatteringA) {
        if (!(plasmaEnergyEv >= 0 && bulkDampingEv >= 0 && fermiVelocityMs >= 0 && surfaceScatteringA >= 0)) {
            throw new IllegalArgumentException("metal parameters must be >= 0");
        }
        plasmaEv = plasmaEnergyEv;
        dampingEv = bulkDampingEv;
        fermiVelocity = fermiVelocityMs;
        surfaceA = surfaceScatteringA;
        computed = false;
        tab.clear();
        if (shapeSet) {
            nodes.prepareDamping(plasmaEv, dampingEv, fermiVelocity, surfaceA);
        }
        return this;
    }

    /** Polarisability correction ({@link Polarizability.Method#AUTO} by default). */
    public ParticleEnsemble setMethod(Polarizability.Method m) {
        method = java.util.Objects.requireNonNull(m, "method");
        computed = false;
        tab.clear();
        return this;
    }

    /** The method actually used for the current shape (AUTO resolved). */
    public Polarizability.Method effectiveMethod() {
        requireShape();
        if (method == Polarizability.Method.AUTO) {
            return nodes.sphere ? Polarizability.Method.MIE : Polarizability.Method.MLWA;
        }
        if ((method == Polarizability.Method.MIE_DIPOLE || method == Polarizability.Method.MIE) && !nodes.sphere) {
            throw new IllegalArgumentException("the Mie polarisability needs spheres (p = q = 1), got p = "
                    + nodes.inPlane + ", q = " + nodes.outOfPlane);
        }
        return method;
    }

    /**
     * Ensemble averages at one wavelength. Allocation-free.
     *
     * @param lambdaNm vacuum wavelength (nm)
     * @param epsRe    bulk metal Re ε (the size correction is applied per node)
     * @param epsIm    bulk metal Im ε
     * @param hRe      host Re ε_h
     * @param hIm      host Im ε_h (≥ 0)
     * @param z0Nm     distance from the particle centre to the interface with a neighbouring absorber (nm);
     *                 +∞ when there is none; raised to r_eq per node
     * @param quenchNm quenching distance δ_q (nm) from the metal surface, 0 for none
     */
    public void compute(double lambdaNm, double epsRe, double epsIm, double hRe, double hIm, double z0Nm,
                        double quenchNm) {
        requireShape();
        if (!(lambdaNm > 0) || !(hIm >= 0) || !(z0Nm > 0) || !(quenchNm >= 0) || Double.isInfinite(quenchNm)) {
            throw new IllegalArgumentException("need lambda > 0, Im eps_host >= 0, z0 > 0, quench >= 0");
        }
        Polarizability.Method m = effectiveMethod();
        lambda = lambdaNm;
        hostRe = hRe;
        hostIm = hIm;
        z0 = z0Nm;
        quench = quenchNm;
        near.prepare(nodes, z0Nm, quenchNm);
        hostIndex = indexRe(hRe, hIm);
        ExactSums.sum(nodes, near, m, lambdaNm, epsRe, epsIm, hRe, hIm, avg);
        computed = true;
    }

    /**
     * Attaches a table of single-sphere quantities for the current shape and metal, to be read by
     * {@link #compute(int, double, double)} instead of the Mie coefficients. It is attached only when it
     * applies exactly: spheres (p = q = 1) with the Mie dipole, the table built for the same free-electron
     * parameters, and every node's diameter inside the table's range; otherwise nothing is attached and
     * the caller uses {@link #compute(double, double, double, double, double, double, double)}. The
     * attachment ends with the next {@link #setShape}, {@link #setMetal} or {@link #setMethod}.
     * Allocation-free.
     *
     * @return whether the table is attached
     */
    public boolean attach(DipoleTable t) {
        requireShape();
        tab.clear();
        if (t == null || !nodes.sphere || effectiveMethod() != Polarizability.Method.MIE
                || !t.matchesMetal(plasmaEv, dampingEv, fermiVelocity, surfaceA)) {
            return false;
        }
        boolean ok = tab.attach(t, nodes);
        computed = false;
        return ok;
    }

    /** Whether a table is attached ({@link #attach}). */
    public boolean tabulated() {
        return tab.table != null;
    }

    /**
     * Ensemble averages at wavelength i of the attached table (its wavelength, bulk metal and host
     * permittivity), the node quantities interpolated instead of computed; every average is then formed
     * exactly as in {@link #compute(double, double, double, double, double, double, double)}.
     * Allocation-free.
     *
     * @param z0Nm     distance from the particle centre to a neighbouring absorber (nm), +∞ for none
     * @param quenchNm quenching distance δ_q (nm)
     * @throws IllegalStateException when no table is attached
     */
    public void compute(int i, double z0Nm, double quenchNm) {
        DipoleTable t = tab.table;
        if (t == null) {
            throw new IllegalStateException("no table attached");
        }
        if (!(z0Nm > 0) || !(quenchNm >= 0) || Double.isInfinite(quenchNm)) {
            throw new IllegalArgumentException("need z0 > 0, quench >= 0");
        }
        double lambdaNm = t.wavelength(i);
        double hRe = t.hostRe(i);
        double hIm = t.hostIm(i);
        lambda = lambdaNm;
        hostRe = hRe;
        hostIm = hIm;
        z0 = z0Nm;
        quench = quenchNm;
        near.prepare(nodes, z0Nm, quenchNm);
        double nh = indexRe(hRe, hIm);
        hostIndex = nh;
        double k = 2 * Math.PI * nh / lambdaNm;
        double k2 = k * k;
        double scaK = k2 * k2 / (6 * Math.PI);
        tab.prepare(nodes, near, z0Nm, quenchNm);
        double sAr = tab.sAr[i];
        double sAi = tab.sAi[i];
        double absA = tab.abs[i];
        double scA = tab.sca[i];
        double fwA = tab.fwd[i];
        double r3A = tab.r3[i];
        double z3A = tab.z3[i];
        double hostA = tab.host[i];
        double qA = tab.quenched[i];
        // spheres: the three axes and both in-plane polarisations are the same
        for (int j = 0; j < 3; j++) {
            avg.alphaRe[j] = sAr;
            avg.alphaIm[j] = sAi;
        }
        EnsembleAverages.set(avg.absMetal, absA, absA);
        EnsembleAverages.set(avg.sca, scA, scA);
        EnsembleAverages.set(avg.fwd, fwA, fwA);
        EnsembleAverages.set(avg.a2r3, r3A, r3A);
        EnsembleAverages.set(avg.a2z3, z3A, z3A);
        double nb = 1 / (64 * Math.PI);
        EnsembleAverages.set(avg.nearNeighbour, nb * z3A, nb * z3A);
        EnsembleAverages.set(avg.nearHost, hostA, hostA);
        EnsembleAverages.set(avg.nearQuench, qA, qA);
        avg.shellHost = near.shellSum;
        computed = true;
    }


    /** Re √ε_h as {@link Polarizability#hostIndexRe}, with |ε_h| from its square (no hypot). */
    static double indexRe(double re, double im) {
        if (im == 0 && re >= 0) {
            return Math.sqrt(re);
        }
        return Math.sqrt(0.5 * (Math.sqrt(re * re + im * im) + re));
    }


    // ----- geometry (no wavelength) -----

    /** Layer thickness h = 2c of the median particle (nm). */
    public double thickness() {
        requireShape();
        return nodes.thickness;
    }

    /** Number per area n_A = θ/(π⟨ab⟩) (nm⁻²). */
    public double numberPerArea() {
        requireShape();
        return nodes.numberPerArea;
    }

    /** Number per volume n_V = n_A/h (nm⁻³). */
    public double numberPerVolume() {
        requireShape();
        return nodes.numberPerArea / nodes.thickness;
    }

    /** Volume fraction f = n_A⟨V⟩/h. */
    public double volumeFraction() {
        requireShape();
        return nodes.numberPerArea * nodes.meanVolume / nodes.thickness;
    }

    /** ⟨V⟩ (nm³). */
    public double meanVolume() {
        requireShape();
        return nodes.meanVolume;
    }

    /** ⟨ab⟩ (nm²). */
    public double meanAb() {
        requireShape();
        return nodes.meanAb;
    }

    /** ⟨D²⟩ from the quadrature (nm²). */
    public double meanDiameterSquared() {
        requireShape();
        return nodes.meanDiameterSquared();
    }

    /** Depolarisation factor L along an axis ({@link #AXIS_A}, {@link #AXIS_B}, {@link #AXIS_C}). */
    public double depolarization(int axis) {
        requireShape();
        return nodes.depol[axis];
    }

    /** Number of quadrature nodes in use (1 when CV = 0). */
    public int activeNodes() {
        requireShape();
        return nodes.active;
    }

    /** Diameter of node i (nm). */
    public double nodeDiameter(int i) {
        requireShape();
        return nodes.diameter[i];
    }

    /** Probability weight of node i. */
    public double nodeWeight(int i) {
        requireShape();
        return nodes.weight[i];
    }

    /** Semi-axis j of node i (nm). */
    public double nodeSemiAxis(int i, int j) {
        requireShape();
        return nodes.axes[3 * i + j];
    }

    /** Effective mean free path ℓ = 4V/S of node i (nm). */
    public double nodeMeanFreePath(int i) {
        requireShape();
        return nodes.meanFreePath[i];
    }

    /** The geometry as an immutable record (allocates; once per sample). */
    public Geometry geometry() {
        requireShape();
        EnsembleNodes n = nodes;
        return new Geometry(n.d50, n.cv, n.inPlane, n.outOfPlane, n.coverage, n.thickness, n.numberPerArea,
                numberPerVolume(), volumeFraction(), n.meanVolume, n.meanAb, n.depol[0], n.depol[1], n.depol[2]);
    }

    /** Geometry of a layer with the default 12-node rule, without any optics. */
    public static Geometry geometry(double medianDiameterNm, double sizeCv, double inPlaneAspect,
                                    double outOfPlaneAspect, double coverageFraction) {
        return new ParticleEnsemble().setShape(medianDiameterNm, sizeCv, inPlaneAspect, outOfPlaneAspect,
                coverageFraction).geometry();
    }

    /**
     * Wavelength-free description of the particle layer.
     *
     * @param thickness       h = 2c at D₅₀ (nm)
     * @param numberPerArea   n_A (nm⁻²)
     * @param numberPerVolume n_V (nm⁻³)
     * @param volumeFraction  f
     * @param meanVolume      ⟨V⟩ (nm³)
     * @param meanAb          ⟨ab⟩ (nm²)
     * @param depolA          L_a
     * @param depolB          L_b
     * @param depolC          L_c
     */
    public record Geometry(double medianDiameter, double sizeCv, double inPlaneAspect, double outOfPlaneAspect,
                           double coverage, double thickness, double numberPerArea, double numberPerVolume,
                           double volumeFraction, double meanVolume, double meanAb, double depolA, double depolB,
                           double depolC) {
        /** True when f exceeds {@link EffectiveMedium#DENSE_LIMIT}: Maxwell Garnett is strained. */
        public boolean dense() {
            return EffectiveMedium.isDense(volumeFraction);
        }
    }

    // ----- optics at the last computed wavelength -----

    /** Wavelength of the last {@link #compute} (nm). */
    public double wavelength() {
        requireComputed();
        return lambda;
    }

    public double hostRe() {
        requireComputed();
        return hostRe;
    }

    public double hostIm() {
        requireComputed();
        return hostIm;
    }

    /** Re n_h = Re √ε_h of the last compute ({@link Polarizability#hostIndexRe}, its modulus without hypot). */
    public double hostIndexRe() {
        requireComputed();
        return hostIndex;
    }

    /** True when the last compute had a neighbouring absorber (finite z₀). */
    public boolean hasNeighbour() {
        requireComputed();
        return !Double.isInfinite(z0);
    }

    /** Quenching distance of the last compute (nm). */
    public double quenchDistance() {
        requireComputed();
        return quench;
    }

    /** Re ⟨α_axis⟩ (nm³). */
    public double alphaRe(int axis) {
        requireComputed();
        return avg.alphaRe[axis];
    }

    /** Im ⟨α_axis⟩ (nm³). */
    public double alphaIm(int axis) {
        requireComputed();
        return avg.alphaIm[axis];
    }

    /** ⟨σ_abs,metal⟩ (nm²) for polarisation {@link #AXIS_A}, {@link #AXIS_B} or {@link #UNPOLARIZED}. */
    public double metalAbsorption(int pol) {
        requireComputed();
        return avg.absMetal[pol];
    }

    /** ⟨σ_sca⟩ (nm²), k real (see {@link Polarizability}). */
    public double scattering(int pol) {
        requireComputed();
        return avg.sca[pol];
    }

    /** ⟨σ_sca into the forward hemisphere⟩ (nm²): full series for spheres, half of σ_sca otherwise. */
    public double forwardScattering(int pol) {
        requireComputed();
        return avg.fwd[pol];
    }

    /**
     * Share of the scattered light heading into the forward hemisphere, ⟨σ_sca,fwd⟩/⟨σ_sca⟩ (the average of
     * the per-particle parts, then one ratio); 1/2 when nothing scatters.
     */
    public double forwardShare(int pol) {
        requireComputed();
        return avg.sca[pol] > 0 ? avg.fwd[pol] / avg.sca[pol] : 0.5;
    }

    /** The near-field host cap summed over the nodes along a (nm³, {@link EnsembleAverages#hostCap}). */
    double nearFieldHostCap() {
        requireComputed();
        return avg.hostCap;
    }

    /** ⟨|α|²/r_eq³⟩ (nm³). */
    public double alpha2OverR3(int pol) {
        requireComputed();
        return avg.a2r3[pol];
    }

    /** ⟨|α|²/z₀³⟩ with z₀ ≥ r_eq per node (nm³); 0 without a neighbouring absorber. */
    public double alpha2OverZ03(int pol) {
        requireComputed();
        return avg.a2z3[pol];
    }

    /**
     * ⟨|α|² (1/(6π r_eq³) − s/(64π z₀³))⟩ (nm³): the dipole near field on the host side, integrated
     * outside the equivalent sphere; κ_h n_V times this is the near-field host absorption rate.
     */
    public double nearFieldHost(int pol) {
        requireComputed();
        return avg.nearHost[pol];
    }

    /** ⟨|α|²/(64π z₀³)⟩ (nm³): the near field reaching a neighbouring absorber; 0 without one. */
    public double nearFieldNeighbour(int pol) {
        requireComputed();
        return avg.nearNeighbour[pol];
    }

    /** The part of {@link #nearFieldHost} within δ_q of the equivalent sphere's surface (nm³). */
    public double nearFieldQuenched(int pol) {
        requireComputed();
        return avg.nearQuench[pol];
    }

    /** ⟨volume of the host-side quenching shell r_eq &lt; r &lt; r_eq + δ_q⟩ (nm³), 0 when δ_q = 0. */
    public double quenchShellVolume() {
        requireComputed();
        return avg.shellHost;
    }

    /** Maxwell Garnett ε_eff along an axis ({@link EffectiveMedium#maxwellGarnett}). */
    public void maxwellGarnett(int axis, double[] out) {
        requireComputed();
        double nv = numberPerVolume();
        EffectiveMedium.maxwellGarnett(hostRe, hostIm, nodes.depol[axis], nv * avg.alphaRe[axis], nv * avg.alphaIm[axis], out);
    }

    /**
     * Bruggeman ε_eff along an axis, with the ensemble's equivalent inclusion permittivity
     * ({@link EffectiveMedium#inclusionPermittivity}: the one that makes Maxwell Garnett reproduce n_V⟨α⟩).
     */
    public void bruggeman(int axis, double[] out) {
        requireComputed();
        double nv = numberPerVolume();
        double f = volumeFraction();
        if (f == 0) {
            out[0] = hostRe;
            out[1] = hostIm;
            return;
        }
        EffectiveMedium.inclusionPermittivity(hostRe, hostIm, nodes.depol[axis], nv * avg.alphaRe[axis], nv * avg.alphaIm[axis], f,
                out);
        EffectiveMedium.bruggeman(out[0], out[1], hostRe, hostIm, f, nodes.depol[axis], out);
    }

    private void requireShape() {
        if (!shapeSet) {
            throw new IllegalStateException("setShape must be called first");
        }
    }

    private void requireComputed() {
        if (!computed) {
            throw new IllegalStateException("compute must be called after the last setting change");
        }
    }

    private static void checkShape(double d50, double cv, double p, double q, double theta) {
        if (!(d50 > 0) || Double.isInfinite(d50)) {
            throw new IllegalArgumentException("median diameter must be finite and > 0 nm, got " + d50);
        }
        if (!(cv >= 0) || Double.isInfinite(cv)) {
            throw new IllegalArgumentException("size CV must be finite and >= 0, got " + cv);
        }
        if (!(p >= 1) || Double.isInfinite(p)) {
            throw new IllegalArgumentException("in-plane aspect ratio a/b must be >= 1, got " + p);
        }
        if (!(q > 0) || Double.isInfinite(q)) {
            throw new IllegalArgumentException("out-of-plane aspect ratio c/a must be > 0, got " + q);
        }
        if (!(theta >= 0 && theta <= 1)) {
            throw new IllegalArgumentException("coverage must be in [0, 1], got " + theta);
        }
    }
}

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

    private final GaussHermite rule;
    private final int maxNodes;
    private final double[] weight;
    private final double[] diameter;
    private final double[][] axes;
    private final double[] volume;
    private final double[] meanFreePath;
    private final double[] depol = new double[3];
    private final double[] tmp = new double[2];
    private int active;

    // per node, set once per sample by setShape / setMetal (the wavelength loop only reads them)
    private final double[] radius;
    private final double[] invR3;
    private final double[] invVolume;
    /** 1/(4π a_j) of node i at [3i + j] (MLWA dynamic depolarisation). */
    private final double[] invFourPiAxis;
    /** ħ²ω_p² ħΔγ, ħγ₀ ħγ and ħγ₀ + ħγ of node i (size correction, {@link MetalPermittivity#sizeCorrected}). */
    private final double[] dampNum;
    private final double[] dampProd;
    private final double[] dampSum;
    private boolean sizeCorrection;

    // per node near-field integrals, valid for (nearZ0, nearQuench) until the shape changes
    private final double[] hostNear16;
    private final double[] quenchNear16;
    private final double[] invZ3;
    private double shellSum;
    private boolean nearValid;
    private double nearZ0;
    private double nearQuenchNm;

    private boolean shapeSet;
    private double d50;
    private double cv;
    private double inPlane;
    private double outOfPlane;
    private double coverage;
    private double sigmaLn;
    private double thickness;
    private double numberPerArea;
    private double meanVolume;
    private double meanAb;
    private boolean sphere;

    private double plasmaEv;
    private double dampingEv;
    private double fermiVelocity;
    private double surfaceA;
    private Polarizability.Method method = Polarizability.Method.AUTO;

    // the attached sphere table (null: exact path) and each node's stencil in it
    private DipoleTable table;
    private final int[] stencilOffset;
    private final double[] stencilWeight;
    // the attached table's sums over the nodes for every wavelength, valid for (tabZ0, tabQuench)
    private double[] tabSAr = new double[0];
    private double[] tabSAi = new double[0];
    private double[] tabAbs = new double[0];
    private double[] tabA2 = new double[0];
    private double[] tabR3 = new double[0];
    private double[] tabZ3 = new double[0];
    private double[] tabHost = new double[0];
    private double[] tabQ = new double[0];
    private boolean tabValid;
    private double tabZ0;
    private double tabQuench;

    private boolean computed;
    private double lambda;
    private double hostRe;
    private double hostIm;
    private double hostIndex;
    private double z0;
    private double quench;
    private final double[] alphaRe = new double[3];
    private final double[] alphaIm = new double[3];
    private final double[] absMetal = new double[3];
    private final double[] sca = new double[3];
    private final double[] a2r3 = new double[3];
    private final double[] a2z3 = new double[3];
    private final double[] nearHost = new double[3];
    private final double[] nearQuench = new double[3];
    private final double[] nearNeighbour = new double[3];
    private double shellHost;

    /** Scratch for the default 12-node rule. */
    public ParticleEnsemble() {
        this(DEFAULT_NODES);
    }

    /** Scratch for a rule with {@code nodes} Gauss–Hermite nodes (one instance per thread). */
    public ParticleEnsemble(int nodes) {
        this.rule = GaussHermite.of(nodes);
        this.maxNodes = nodes;
        this.weight = new double[nodes];
        this.diameter = new double[nodes];
        this.axes = new double[nodes][3];
        this.volume = new double[nodes];
        this.meanFreePath = new double[nodes];
        this.radius = new double[nodes];
        this.invR3 = new double[nodes];
        this.invVolume = new double[nodes];
        this.invFourPiAxis = new double[3 * nodes];
        this.dampNum = new double[nodes];
        this.dampProd = new double[nodes];
        this.dampSum = new double[nodes];
        this.hostNear16 = new double[nodes];
        this.quenchNear16 = new double[nodes];
        this.invZ3 = new double[nodes];
        this.stencilOffset = new int[nodes];
        this.stencilWeight = new double[4 * nodes];
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
        d50 = medianDiameterNm;
        cv = sizeCv;
        inPlane = inPlaneAspect;
        outOfPlane = outOfPlaneAspect;
        coverage = coverageFraction;
        sigmaLn = Math.sqrt(Math.log1p(sizeCv * sizeCv));
        sphere = inPlaneAspect == 1 && outOfPlaneAspect == 1;
        double aUnit = 0.5 * Math.cbrt(inPlaneAspect / outOfPlaneAspect);
        double bUnit = aUnit / inPlaneAspect;
        double cUnit = outOfPlaneAspect * aUnit;
        if (sphere) {
            aUnit = 0.5;
            bUnit = 0.5;
            cUnit = 0.5;
        }
        Depolarization.factors(aUnit, bUnit, cUnit, depol);
        double lUnit = MetalPermittivity.meanFreePath(aUnit, bUnit, cUnit);
        active = sizeCv == 0 ? 1 : maxNodes;
        double sv = 0;
        double sab = 0;
        for (int i = 0; i < active; i++) {
            double d = active == 1 ? medianDiameterNm : medianDiameterNm * Math.exp(Math.sqrt(2) * sigmaLn * rule.node(i));
            weight[i] = active == 1 ? 1 : rule.weight(i);
            diameter[i] = d;
            axes[i][0] = aUnit * d;
            axes[i][1] = bUnit * d;
            axes[i][2] = cUnit * d;
            volume[i] = Math.PI * d * d * d / 6;
            meanFreePath[i] = lUnit * d;
            sv += weight[i] * volume[i];
            sab += weight[i] * axes[i][0] * axes[i][1];
            double r = 0.5 * d;
            radius[i] = r;
            invR3[i] = 1 / (r * r * r);
            invVolume[i] = 1 / volume[i];
            for (int j = 0; j < 3; j++) {
                invFourPiAxis[3 * i + j] = 1 / (4 * Math.PI * axes[i][j]);
            }
        }
        meanVolume = sv;
        meanAb = sab;
        thickness = 2 * cUnit * medianDiameterNm;
        numberPerArea = coverageFraction / (Math.PI * sab);
        shapeSet = true;
        computed = false;
        nearValid = false;
        table = null;
        prepareDamping();
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
        table = null;
        if (shapeSet) {
            prepareDamping();
        }
        return this;
    }

    /** The wavelength-free terms of the size correction per node (once per sample). */
    private void prepareDamping() {
        sizeCorrection = surfaceA > 0 && fermiVelocity > 0;
        if (!sizeCorrection) {
            return;
        }
        for (int i = 0; i < active; i++) {
            double dg = MetalPermittivity.surfaceDampingEv(meanFreePath[i], fermiVelocity, surfaceA);
            double g = dampingEv + dg;
            dampNum[i] = plasmaEv * plasmaEv * dg;
            dampProd[i] = dampingEv * g;
            dampSum[i] = dampingEv + g;
        }
    }

    /** The near-field integrals per node for one (z₀, δ_q): they change with the sample, not the wavelength. */
    private void prepareNearField(double z0Nm, double quenchNm) {
        boolean neighbour = !Double.isInfinite(z0Nm);
        double sum = 0;
        double norm = 1 / (16 * Math.PI * Math.PI);
        for (int i = 0; i < active; i++) {
            double r = radius[i];
            double zi = Math.max(z0Nm, r);
            double rq = r + quenchNm;
            double hostNearInt = 8 * Math.PI / (3 * r * r * r);
            double quenchInt = quenchNm > 0 ? 8 * Math.PI / 3 * (1 / (r * r * r) - 1 / (rq * rq * rq)) : 0;
            double shell = quenchNm > 0 ? 4 * Math.PI / 3 * (rq * rq * rq - r * r * r) : 0;
            if (neighbour) {
                hostNearInt -= Math.PI / (4 * zi * zi * zi);
                if (quenchNm > 0 && zi < rq) {
                    quenchInt -= Math.PI / (4 * zi * zi * zi) - tail(zi, rq);
                    shell -= Math.PI * (rq - zi) * (rq - zi) * (2 * rq + zi) / 3;
                }
            }
            sum += weight[i] * Math.max(0, shell);
            hostNear16[i] = hostNearInt * norm;
            quenchNear16[i] = Math.max(0, quenchInt) * norm;
            invZ3[i] = neighbour ? 1 / (zi * zi * zi) : 0;
        }
        shellSum = sum;
        nearZ0 = z0Nm;
        nearQuenchNm = quenchNm;
        nearValid = true;
    }

    /** Polarisability correction ({@link Polarizability.Method#AUTO} by default). */
    public ParticleEnsemble setMethod(Polarizability.Method m) {
        method = java.util.Objects.requireNonNull(m, "method");
        computed = false;
        table = null;
        return this;
    }

    /** The method actually used for the current shape (AUTO resolved). */
    public Polarizability.Method effectiveMethod() {
        requireShape();
        if (method == Polarizability.Method.AUTO) {
            return sphere ? Polarizability.Method.MIE_DIPOLE : Polarizability.Method.MLWA;
        }
        if (method == Polarizability.Method.MIE_DIPOLE && !sphere) {
            throw new IllegalArgumentException("the Mie dipole polarisability needs spheres (p = q = 1), got p = "
                    + inPlane + ", q = " + outOfPlane);
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
        if (!nearValid || z0Nm != nearZ0 || quenchNm != nearQuenchNm) {
            prepareNearField(z0Nm, quenchNm);
        }
        boolean mie = m == Polarizability.Method.MIE_DIPOLE;
        boolean mlwa = m == Polarizability.Method.MLWA;
        // everything that depends on the wavelength only
        double nh = indexRe(hRe, hIm);
        hostIndex = nh;
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
        double n0 = indexRe(hRe, 0);
        double k0 = 2 * Math.PI * n0 / lambdaNm;
        double sixPiK03 = 6 * Math.PI / (k0 * k0 * k0);
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
        double[] t = tmp;
        for (int i = 0; i < active; i++) {
            double w = weight[i];
            double r = radius[i];
            double er = epsRe;
            double ei = epsIm;
            if (sizeCorrection) {
                // MetalPermittivity.sizeCorrected with its wavelength-free terms taken from the node
                double dr = e * (e2 - dampProd[i]);
                double di = e2 * dampSum[i];
                double den = dr * dr + di * di;
                er = epsRe + dampNum[i] * di / den;
                ei = epsIm + dampNum[i] * dr / den;
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
                mA = Polarizability.metalAbsorption(lambdaNm, volume[i], lA, er, ei, hRe, hIm, 0, 0, 0, 0);
                mB = Polarizability.metalAbsorption(lambdaNm, volume[i], lB, er, ei, hRe, hIm, 0, 0, 0, 0);
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
        alphaRe[0] = sAr;
        alphaIm[0] = sAi;
        alphaRe[1] = sBr;
        alphaIm[1] = sBi;
        alphaRe[2] = sCr;
        alphaIm[2] = sCi;
        set(absMetal, absA, absB);
        set(sca, scaK * a2A, scaK * a2B);
        set(a2r3, r3A, r3B);
        set(a2z3, z3A, z3B);
        double nb = 1 / (64 * Math.PI);
        set(nearNeighbour, nb * z3A, nb * z3B);
        set(nearHost, hostA, hostB);
        set(nearQuench, qA, qB);
        shellHost = shellSum;
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
        table = null;
        if (t == null || !sphere || effectiveMethod() != Polarizability.Method.MIE_DIPOLE
                || !t.matchesMetal(plasmaEv, dampingEv, fermiVelocity, surfaceA)) {
            return false;
        }
        for (int i = 0; i < active; i++) {
            if (!t.covers(diameter[i])) {
                return false;
            }
        }
        for (int i = 0; i < active; i++) {
            stencilOffset[i] = t.stencil(diameter[i], stencilWeight, 4 * i);
        }
        int nw = t.wavelengths();
        if (tabSAr.length < nw) {
            // once per evaluator (the table's wavelength count does not change between samples)
            tabSAr = new double[nw];
            tabSAi = new double[nw];
            tabAbs = new double[nw];
            tabA2 = new double[nw];
            tabR3 = new double[nw];
            tabZ3 = new double[nw];
            tabHost = new double[nw];
            tabQ = new double[nw];
        }
        table = t;
        tabValid = false;
        computed = false;
        return true;
    }

    /** Whether a table is attached ({@link #attach}). */
    public boolean tabulated() {
        return table != null;
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
        DipoleTable t = table;
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
        if (!nearValid || z0Nm != nearZ0 || quenchNm != nearQuenchNm) {
            prepareNearField(z0Nm, quenchNm);
        }
        double nh = indexRe(hRe, hIm);
        hostIndex = nh;
        double k = 2 * Math.PI * nh / lambdaNm;
        double k2 = k * k;
        double scaK = k2 * k2 / (6 * Math.PI);
        if (!tabValid || z0Nm != tabZ0 || quenchNm != tabQuench) {
            sumNodes(t);
            tabZ0 = z0Nm;
            tabQuench = quenchNm;
            tabValid = true;
        }
        double sAr = tabSAr[i];
        double sAi = tabSAi[i];
        double absA = tabAbs[i];
        double a2A = tabA2[i];
        double r3A = tabR3[i];
        double z3A = tabZ3[i];
        double hostA = tabHost[i];
        double qA = tabQ[i];
        // spheres: the three axes and both in-plane polarisations are the same
        for (int j = 0; j < 3; j++) {
            alphaRe[j] = sAr;
            alphaIm[j] = sAi;
        }
        set(absMetal, absA, absA);
        set(sca, scaK * a2A, scaK * a2A);
        set(a2r3, r3A, r3A);
        set(a2z3, z3A, z3A);
        double nb = 1 / (64 * Math.PI);
        set(nearNeighbour, nb * z3A, nb * z3A);
        set(nearHost, hostA, hostA);
        set(nearQuench, qA, qA);
        shellHost = shellSum;
        computed = true;
    }

    /**
     * The node sums of the attached table at every wavelength at once (node by node, each node's four
     * table rows read front to back); per wavelength the nodes are added in the same order as in
     * {@link #compute(double, double, double, double, double, double, double)}. Needs the near-field
     * integrals of the current (z₀, δ_q).
     */
    private void sumNodes(DipoleTable t) {
        final int nw = t.wavelengths();
        final double[] vals = t.values;
        final int stride = t.rowStride;
        final int q = DipoleTable.QUANTITIES;
        final double[] sr = tabSAr;
        final double[] si = tabSAi;
        final double[] ab = tabAbs;
        final double[] a2 = tabA2;
        final double[] r3 = tabR3;
        final double[] z3 = tabZ3;
        final double[] ho = tabHost;
        final double[] qu = tabQ;
        java.util.Arrays.fill(sr, 0, nw, 0.0);
        java.util.Arrays.fill(si, 0, nw, 0.0);
        java.util.Arrays.fill(ab, 0, nw, 0.0);
        java.util.Arrays.fill(a2, 0, nw, 0.0);
        java.util.Arrays.fill(r3, 0, nw, 0.0);
        java.util.Arrays.fill(z3, 0, nw, 0.0);
        java.util.Arrays.fill(ho, 0, nw, 0.0);
        java.util.Arrays.fill(qu, 0, nw, 0.0);
        for (int n = 0; n < active; n++) {
            final int o0 = stencilOffset[n];
            final int o1 = o0 + stride;
            final int o2 = o1 + stride;
            final int o3 = o2 + stride;
            final int wo = 4 * n;
            final double w0 = stencilWeight[wo];
            final double w1 = stencilWeight[wo + 1];
            final double w2 = stencilWeight[wo + 2];
            final double w3 = stencilWeight[wo + 3];
            final double w = weight[n];
            final double ir3 = invR3[n];
            final double iz3 = invZ3[n];
            final double hn = hostNear16[n];
            final double qn = quenchNear16[n];
            for (int i = 0, o = 0; i < nw; i++, o += q) {
                double aAr = w0 * vals[o0 + o] + w1 * vals[o1 + o] + w2 * vals[o2 + o] + w3 * vals[o3 + o];
                double aAi = w0 * vals[o0 + o + 1] + w1 * vals[o1 + o + 1] + w2 * vals[o2 + o + 1] + w3 * vals[o3 + o + 1];
                double mA = w0 * vals[o0 + o + 2] + w1 * vals[o1 + o + 2] + w2 * vals[o2 + o + 2] + w3 * vals[o3 + o + 2];
                sr[i] += w * aAr;
                si[i] += w * aAi;
                ab[i] += w * Math.max(0, mA);
                double wa = w * (aAr * aAr + aAi * aAi);
                a2[i] += wa;
                r3[i] += wa * ir3;
                z3[i] += wa * iz3;
                ho[i] += wa * hn;
                qu[i] += wa * qn;
            }
        }
    }

    private static void set(double[] q, double a, double b) {
        q[AXIS_A] = a;
        q[AXIS_B] = b;
        q[UNPOLARIZED] = 0.5 * (a + b);
    }

    /** Re √ε_h as {@link Polarizability#hostIndexRe}, with |ε_h| from its square (no hypot). */
    private static double indexRe(double re, double im) {
        if (im == 0 && re >= 0) {
            return Math.sqrt(re);
        }
        return Math.sqrt(0.5 * (Math.sqrt(re * re + im * im) + re));
    }

    /**
     * ∫ (1 + 3cos²ψ) r⁻⁶ dV over r &gt; R and z &gt; z₀ (in-plane dipole, R ≥ z₀):
     * 2π [2/(3R³) − 5z₀/(8R⁴) + z₀³/(12R⁶)], which is π/(4z₀³) at R = z₀.
     */
    static double tail(double z0, double rr) {
        double r3 = rr * rr * rr;
        return 2 * Math.PI * (2 / (3 * r3) - 5 * z0 / (8 * r3 * rr) + z0 * z0 * z0 / (12 * r3 * r3));
    }

    // ----- geometry (no wavelength) -----

    /** Layer thickness h = 2c of the median particle (nm). */
    public double thickness() {
        requireShape();
        return thickness;
    }

    /** Number per area n_A = θ/(π⟨ab⟩) (nm⁻²). */
    public double numberPerArea() {
        requireShape();
        return numberPerArea;
    }

    /** Number per volume n_V = n_A/h (nm⁻³). */
    public double numberPerVolume() {
        requireShape();
        return numberPerArea / thickness;
    }

    /** Volume fraction f = n_A⟨V⟩/h. */
    public double volumeFraction() {
        requireShape();
        return numberPerArea * meanVolume / thickness;
    }

    /** ⟨V⟩ (nm³). */
    public double meanVolume() {
        requireShape();
        return meanVolume;
    }

    /** ⟨ab⟩ (nm²). */
    public double meanAb() {
        requireShape();
        return meanAb;
    }

    /** ⟨D²⟩ from the quadrature (nm²). */
    public double meanDiameterSquared() {
        requireShape();
        double s = 0;
        for (int i = 0; i < active; i++) {
            s += weight[i] * diameter[i] * diameter[i];
        }
        return s;
    }

    /** Depolarisation factor L along an axis ({@link #AXIS_A}, {@link #AXIS_B}, {@link #AXIS_C}). */
    public double depolarization(int axis) {
        requireShape();
        return depol[axis];
    }

    /** Number of quadrature nodes in use (1 when CV = 0). */
    public int activeNodes() {
        requireShape();
        return active;
    }

    /** Diameter of node i (nm). */
    public double nodeDiameter(int i) {
        requireShape();
        return diameter[i];
    }

    /** Probability weight of node i. */
    public double nodeWeight(int i) {
        requireShape();
        return weight[i];
    }

    /** Semi-axis j of node i (nm). */
    public double nodeSemiAxis(int i, int j) {
        requireShape();
        return axes[i][j];
    }

    /** Effective mean free path ℓ = 4V/S of node i (nm). */
    public double nodeMeanFreePath(int i) {
        requireShape();
        return meanFreePath[i];
    }

    /** The geometry as an immutable record (allocates; once per sample). */
    public Geometry geometry() {
        requireShape();
        return new Geometry(d50, cv, inPlane, outOfPlane, coverage, thickness, numberPerArea, numberPerVolume(),
                volumeFraction(), meanVolume, meanAb, depol[0], depol[1], depol[2]);
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
        return alphaRe[axis];
    }

    /** Im ⟨α_axis⟩ (nm³). */
    public double alphaIm(int axis) {
        requireComputed();
        return alphaIm[axis];
    }

    /** ⟨σ_abs,metal⟩ (nm²) for polarisation {@link #AXIS_A}, {@link #AXIS_B} or {@link #UNPOLARIZED}. */
    public double metalAbsorption(int pol) {
        requireComputed();
        return absMetal[pol];
    }

    /** ⟨σ_sca⟩ (nm²), k real (see {@link Polarizability}). */
    public double scattering(int pol) {
        requireComputed();
        return sca[pol];
    }

    /** ⟨|α|²/r_eq³⟩ (nm³). */
    public double alpha2OverR3(int pol) {
        requireComputed();
        return a2r3[pol];
    }

    /** ⟨|α|²/z₀³⟩ with z₀ ≥ r_eq per node (nm³); 0 without a neighbouring absorber. */
    public double alpha2OverZ03(int pol) {
        requireComputed();
        return a2z3[pol];
    }

    /**
     * ⟨|α|² (1/(6π r_eq³) − s/(64π z₀³))⟩ (nm³): the dipole near field on the host side, integrated
     * outside the equivalent sphere; κ_h n_V times this is the near-field host absorption rate.
     */
    public double nearFieldHost(int pol) {
        requireComputed();
        return nearHost[pol];
    }

    /** ⟨|α|²/(64π z₀³)⟩ (nm³): the near field reaching a neighbouring absorber; 0 without one. */
    public double nearFieldNeighbour(int pol) {
        requireComputed();
        return nearNeighbour[pol];
    }

    /** The part of {@link #nearFieldHost} within δ_q of the equivalent sphere's surface (nm³). */
    public double nearFieldQuenched(int pol) {
        requireComputed();
        return nearQuench[pol];
    }

    /** ⟨volume of the host-side quenching shell r_eq &lt; r &lt; r_eq + δ_q⟩ (nm³), 0 when δ_q = 0. */
    public double quenchShellVolume() {
        requireComputed();
        return shellHost;
    }

    /** Maxwell Garnett ε_eff along an axis ({@link EffectiveMedium#maxwellGarnett}). */
    public void maxwellGarnett(int axis, double[] out) {
        requireComputed();
        double nv = numberPerVolume();
        EffectiveMedium.maxwellGarnett(hostRe, hostIm, depol[axis], nv * alphaRe[axis], nv * alphaIm[axis], out);
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
        EffectiveMedium.inclusionPermittivity(hostRe, hostIm, depol[axis], nv * alphaRe[axis], nv * alphaIm[axis], f,
                out);
        EffectiveMedium.bruggeman(out[0], out[1], hostRe, hostIm, f, depol[axis], out);
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

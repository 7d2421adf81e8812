package org.fabspread.device;

/**
 * Drift collection of photogenerated carriers across an absorber with a uniform field: the Hecht
 * relation (K. Hecht, Z. Phys. 77, 235 (1932)).
 *
 * <p>At short circuit the field is E = V_bi / d and the drift lengths are ℓ_e = μ_eτ_e E and
 * ℓ_h = μ_hτ_h E. A pair generated at depth x, measured from the electron-collecting contact, is
 * collected with probability
 * <pre>  η(x) = (ℓ_e/d)(1 − e^{−x/ℓ_e}) + (ℓ_h/d)(1 − e^{−(d−x)/ℓ_h}).</pre>
 * The optical depth x_opt runs from the absorber's front face (the side light enters); x = x_opt when
 * the electrons are collected at the front (inverted cell), x = d − x_opt otherwise. In x_opt the
 * relation is a sum of three exponentials, η(x_opt) = Σ_m c_m e^{s_m x_opt} (one of them constant), so
 * that the collected fraction of a transfer-matrix absorption profile a(x) is Σ_m c_m ∫ a(x) e^{s_m x} dx,
 * a closed form of the profile.
 *
 * <p>Numerical range: the drift lengths are held in [d/600, 10⁶ d]. The lower bound keeps the growing
 * exponential e^{x/ℓ} finite (the collected fraction from that carrier is then below 1/600 anyway);
 * the upper bound keeps the cancellation between the constant and the slowly decaying term below about
 * 1e-9 while changing η by at most d/(2ℓ) = 5e-7. {@link #eta(double)} and {@link #uniformAverage()}
 * use the same clamped lengths so that every view of one instance agrees.
 *
 * @param electronDriftNm  ℓ_e in nm (clamped)
 * @param holeDriftNm      ℓ_h in nm (clamped)
 * @param thicknessNm      absorber thickness d in nm
 * @param electronsAtFront true when electrons leave through the contact on the light-entry side
 */
record HechtCollection(double electronDriftNm, double holeDriftNm, double thicknessNm,
                              boolean electronsAtFront) {

    /** Smallest drift length, as a fraction of the thickness. */
    public static final double MIN_DRIFT_OVER_THICKNESS = 1.0 / 600.0;
    /** Largest drift length, as a multiple of the thickness. */
    public static final double MAX_DRIFT_OVER_THICKNESS = 1e6;
    /** Number of exponential terms of {@link #coefficients} / {@link #rates}. */
    public static final int TERMS = 3;
    /** nm per cm. */
    private static final double NM_PER_CM = 1e7;

    public HechtCollection {
        if (!(thicknessNm > 0) || !Double.isFinite(thicknessNm)) {
            throw new IllegalArgumentException("absorber thickness must be > 0 nm, got " + thicknessNm);
        }
        if (!(electronDriftNm >= 0) || !(holeDriftNm >= 0)) {
            throw new IllegalArgumentException("drift lengths must be >= 0, got " + electronDriftNm + ", " + holeDriftNm);
        }
        electronDriftNm = clamp(electronDriftNm, thicknessNm);
        holeDriftNm = clamp(holeDriftNm, thicknessNm);
    }

    /**
     * From mobility–lifetime products.
     *
     * @param electronMuTau μ_eτ_e, cm²/V
     * @param holeMuTau     μ_hτ_h, cm²/V
     * @param builtInVolts  V_bi, V; must be &gt; 0
     * @param thicknessNm   absorber thickness, nm
     * @throws IllegalArgumentException when V_bi ≤ 0 or a μτ is negative
     */
    public static HechtCollection of(double electronMuTau, double holeMuTau, double builtInVolts,
                                     double thicknessNm, boolean electronsAtFront) {
        return new HechtCollection(driftLengthNm(electronMuTau, builtInVolts, thicknessNm),
                driftLengthNm(holeMuTau, builtInVolts, thicknessNm), thicknessNm, electronsAtFront);
    }

    /**
     * Drift length ℓ = μτ E in nm with E = V_bi / d: μτ [cm²/V] · V_bi [V] / d [cm] gives cm, so
     * ℓ_nm = μτ · V_bi · 10¹⁴ / d_nm (not clamped).
     */
    public static double driftLengthNm(double muTauCm2PerV, double builtInVolts, double thicknessNm) {
        if (!(builtInVolts > 0)) {
            throw new IllegalArgumentException("built-in voltage must be > 0 V for drift collection at short circuit, got "
                    + builtInVolts + " V");
        }
        if (!(muTauCm2PerV >= 0)) {
            throw new IllegalArgumentException("mobility-lifetime product must be >= 0 cm^2/V, got " + muTauCm2PerV);
        }
        double dCm = thicknessNm / NM_PER_CM;
        double fieldVPerCm = builtInVolts / dCm;
        return muTauCm2PerV * fieldVPerCm * NM_PER_CM;
    }

    private static double clamp(double ell, double d) {
        return Math.min(Math.max(ell, d * MIN_DRIFT_OVER_THICKNESS), d * MAX_DRIFT_OVER_THICKNESS);
    }

    /**
     * Writes the exponential form of η in the optical depth coordinate (x_opt = 0 at the front face):
     * η(x_opt) = Σ_{m&lt;3} c[m] e^{s[m] x_opt}, s in 1/nm. Allocation-free.
     */
    public void exponentials(double[] c, double[] s) {
        exponentials(electronDriftNm, holeDriftNm, thicknessNm, electronsAtFront, c, s);
    }

    /**
     * Static form of {@link #exponentials(double[], double[])} for hot loops; the drift lengths are
     * used as given (callers pass lengths already in the clamped range, see {@link #clampDrift}).
     */
    public static void exponentials(double ellE, double ellH, double d, boolean electronsAtFront,
                                    double[] c, double[] s) {
        double re = ellE / d;
        double rh = ellH / d;
        c[0] = re + rh;
        s[0] = 0;
        if (electronsAtFront) {
            // x = x_opt: −(ℓe/d) e^{−x/ℓe} − (ℓh/d) e^{−d/ℓh} e^{x/ℓh}
            c[1] = -re;
            s[1] = -1.0 / ellE;
            c[2] = -rh * Math.exp(-d / ellH);
            s[2] = 1.0 / ellH;
        } else {
            // x = d − x_opt: −(ℓe/d) e^{−d/ℓe} e^{x_opt/ℓe} − (ℓh/d) e^{−x_opt/ℓh}
            c[1] = -re * Math.exp(-d / ellE);
            s[1] = 1.0 / ellE;
            c[2] = -rh;
            s[2] = -1.0 / ellH;
        }
    }

    /** A drift length held in the numerically safe range for a layer of thickness d. */
    public static double clampDrift(double ellNm, double d) {
        return clamp(ellNm, d);
    }

    /** The coefficients c_m of {@link #exponentials(double[], double[])} (new array). */
    public double[] coefficients() {
        double[] c = new double[TERMS];
        exponentials(c, new double[TERMS]);
        return c;
    }

    /** The rates s_m (1/nm) of {@link #exponentials(double[], double[])} (new array). */
    public double[] rates() {
        double[] s = new double[TERMS];
        exponentials(new double[TERMS], s);
        return s;
    }

    /** η at optical depth x_opt (nm from the front face), evaluated directly (no exponential form). */
    public double eta(double xOptNm) {
        return eta(electronDriftNm, holeDriftNm, thicknessNm, electronsAtFront, xOptNm);
    }

    /** Static form of {@link #eta(double)}. */
    public static double eta(double ellE, double ellH, double d, boolean electronsAtFront, double xOptNm) {
        double x = electronsAtFront ? xOptNm : d - xOptNm;
        // (ℓ/d)(1 − e^{−y/ℓ}) written with expm1 so that a long drift length loses nothing
        return -(ellE / d) * Math.expm1(-x / ellE) - (ellH / d) * Math.expm1(-(d - x) / ellH);
    }

    /** ⟨η⟩ for uniform generation across the absorber. */
    public double uniformAverage() {
        return uniformAverage(electronDriftNm, holeDriftNm, thicknessNm);
    }

    /**
     * ⟨η⟩ = Σ_{ℓ∈{ℓe,ℓh}} (ℓ/d)[1 − (ℓ/d)(1 − e^{−d/ℓ})], written as (u + e^{−u} − 1)/u² with u = d/ℓ
     * (series for small u).
     */
    public static double uniformAverage(double ellE, double ellH, double d) {
        return averageTerm(d / ellE) + averageTerm(d / ellH);
    }

    /**
     * The mean of η over a slab [x0, x1] of optical depth (nm), for uniform generation there; x0 = x1
     * gives η(x0).
     */
    public double averageOver(double x0, double x1) {
        return averageOver(electronDriftNm, holeDriftNm, thicknessNm, electronsAtFront, x0, x1);
    }

    /** Static form of {@link #averageOver(double, double)}. */
    public static double averageOver(double ellE, double ellH, double d, boolean electronsAtFront,
                                     double x0, double x1) {
        double w = x1 - x0;
        if (!(w > 1e-9 * d)) {
            return eta(ellE, ellH, d, electronsAtFront, 0.5 * (x0 + x1));
        }
        // positions from the electron contact
        double a = electronsAtFront ? x0 : d - x1;
        double b = electronsAtFront ? x1 : d - x0;
        // (1/w)∫_a^b (ℓe/d)(1 − e^{−x/ℓe}) dx = (ℓe/d)[1 − (ℓe/w)(e^{−a/ℓe} − e^{−b/ℓe})]
        double te = (ellE / d) * (1 - (ellE / w) * (Math.exp(-a / ellE) * -Math.expm1(-(b - a) / ellE)));
        // hole term in y = d − x: from d − b to d − a
        double ah = d - b;
        double th = (ellH / d) * (1 - (ellH / w) * (Math.exp(-ah / ellH) * -Math.expm1(-(b - a) / ellH)));
        return te + th;
    }

    private static double averageTerm(double u) {
        if (u < 1e-3) {
            // 1/2 − u/6 + u²/24 − u³/120
            return 0.5 - u / 6 + u * u / 24 - u * u * u / 120;
        }
        return (u + Math.expm1(-u)) / (u * u);
    }
}

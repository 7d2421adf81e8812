package org.fabspread.particles;

/**
 * Effective-medium mixing rules for a layer of aligned ellipsoidal inclusions in a host, along one
 * principal axis with depolarisation factor L (Sihvola, <i>Electromagnetic Mixing Formulas and
 * Applications</i>, 1999; Bohren &amp; Huffman 1983, ch. 8).
 *
 * <p>Maxwell Garnett written with the polarisability volume α of {@link Polarizability} (p = ε₀ε_h α E₀)
 * and number density n_V: ε_eff = ε_h (1 + (1 − L) n_Vα)/(1 − L n_Vα). With the quasi-static
 * α = V(ε − ε_h)/(ε_h + L(ε − ε_h)) and f = n_V V this is identical to Sihvola's aligned-ellipsoid
 * formula ε_eff = ε_h + f ε_h (ε − ε_h)/(ε_h + (1 − f)L(ε − ε_h)), and for spheres (L = 1/3) to the classic
 * ε_h (ε + 2ε_h + 2f(ε − ε_h))/(ε + 2ε_h − f(ε − ε_h)) (Maxwell Garnett 1904). With a radiation-corrected
 * α (MLWA, Mie dipole) it is the extended Maxwell Garnett form.
 *
 * <p>Bruggeman (symmetric): f(ε − ε_e)/(ε_e + L(ε − ε_e)) + (1 − f)(ε_h − ε_e)/(ε_e + L(ε_h − ε_e)) = 0,
 * which is the quadratic (1 − L)ε_e² − βε_e − Lεε_h = 0, β = f((1 − L)ε − Lε_h) + (1 − f)((1 − L)ε_h − Lε);
 * both roots are computed without cancellation and the physical one is chosen: Im ε_e ≥ 0, and of two
 * such roots the one nearer the Maxwell Garnett value (the branch that tends to ε_h as f → 0).
 */
public final class EffectiveMedium {
    /** Volume fraction above which Maxwell Garnett is strained and a warning is due. */
    public static final double DENSE_LIMIT = 0.3;

    private EffectiveMedium() {
    }

    /** True when f &gt; {@link #DENSE_LIMIT}. */
    public static boolean isDense(double volumeFraction) {
        return volumeFraction > DENSE_LIMIT;
    }

    /**
     * Maxwell Garnett with the ensemble polarisability: ε_h (1 + (1 − L) u)/(1 − L u), u = n_V⟨α⟩.
     * u = 0 returns ε_h exactly.
     */
    public static void maxwellGarnett(double hostRe, double hostIm, double depol, double nvAlphaRe,
                                      double nvAlphaIm, double[] out) {
        if (nvAlphaRe == 0 && nvAlphaIm == 0) {
            out[0] = hostRe;
            out[1] = hostIm;
            return;
        }
        Cx.div(1 + (1 - depol) * nvAlphaRe, (1 - depol) * nvAlphaIm, 1 - depol * nvAlphaRe, -depol * nvAlphaIm, out);
        double qr = out[0];
        double qi = out[1];
        out[0] = hostRe * qr - hostIm * qi;
        out[1] = hostRe * qi + hostIm * qr;
    }

    /**
     * Maxwell Garnett from the inclusion permittivity and volume fraction (Sihvola's aligned-ellipsoid
     * form): ε_h + f ε_h (ε − ε_h)/(ε_h + (1 − f) L (ε − ε_h)).
     */
    public static void maxwellGarnettClassic(double epsRe, double epsIm, double hostRe, double hostIm,
                                             double volumeFraction, double depol, double[] out) {
        double dr = epsRe - hostRe;
        double di = epsIm - hostIm;
        double nr = volumeFraction * (hostRe * dr - hostIm * di);
        double ni = volumeFraction * (hostRe * di + hostIm * dr);
        double s = (1 - volumeFraction) * depol;
        Cx.div(nr, ni, hostRe + s * dr, hostIm + s * di, out);
        out[0] += hostRe;
        out[1] += hostIm;
    }

    /**
     * The single inclusion permittivity ε* that, at volume fraction f, gives the same n_V⟨α⟩ in the
     * quasi-static form: with u = n_V⟨α⟩/f, ε* = ε_h (1 + (1 − L)u)/(1 − Lu). It carries whatever the
     * ensemble α carries (size spread, radiative damping); Maxwell Garnett with ε* and f reproduces
     * {@link #maxwellGarnett} exactly, so it is the natural input for {@link #bruggeman} on an ensemble.
     */
    public static void inclusionPermittivity(double hostRe, double hostIm, double depol, double nvAlphaRe,
                                             double nvAlphaIm, double volumeFraction, double[] out) {
        if (!(volumeFraction > 0)) {
            throw new IllegalArgumentException("volume fraction must be > 0, got " + volumeFraction);
        }
        maxwellGarnett(hostRe, hostIm, depol, nvAlphaRe / volumeFraction, nvAlphaIm / volumeFraction, out);
    }

    /**
     * Symmetric Bruggeman effective permittivity for aligned inclusions (depolarisation L along the field;
     * L = 1/3 for spheres). f = 0 returns ε_h and f = 1 returns ε exactly.
     */
    public static void bruggeman(double epsRe, double epsIm, double hostRe, double hostIm, double volumeFraction,
                                 double depol, double[] out) {
        if (!(volumeFraction >= 0 && volumeFraction <= 1)) {
            throw new IllegalArgumentException("volume fraction must be in [0, 1], got " + volumeFraction);
        }
        if (!(depol >= 0 && depol <= 1)) {
            throw new IllegalArgumentException("depolarisation factor must be in [0, 1], got " + depol);
        }
        if (volumeFraction == 0) {
            out[0] = hostRe;
            out[1] = hostIm;
            return;
        }
        if (volumeFraction == 1) {
            out[0] = epsRe;
            out[1] = epsIm;
            return;
        }
        double f = volumeFraction;
        double l = depol;
        Complex e = new Complex(epsRe, epsIm);
        Complex h = new Complex(hostRe, hostIm);
        Complex beta = e.times(1 - l).minus(h.times(l)).times(f).plus(h.times(1 - l).minus(e.times(l)).times(1 - f));
        Complex c = e.times(h).times(-l);
        Complex b = beta.negate();
        double a = 1 - l;
        if (a == 0) {
            // linear: −βε_e − εε_h = 0
            Complex r = c.div(b).negate();
            out[0] = r.re();
            out[1] = r.im();
            return;
        }
        Complex sq = b.times(b).minus(c.times(4 * a)).sqrt();
        if (b.re() * sq.re() + b.im() * sq.im() < 0) {
            sq = sq.negate();
        }
        Complex q = b.plus(sq).times(-0.5);
        Complex r1;
        Complex r2;
        if (q.abs2() == 0) {
            r1 = Complex.ZERO;
            r2 = Complex.ZERO;
        } else {
            r1 = q.div(a);
            r2 = c.div(q);
        }
        maxwellGarnettClassic(epsRe, epsIm, hostRe, hostIm, f, l, out);
        Complex mg = Complex.of(out);
        double tol = 1e-12 * (1 + Math.max(r1.abs(), r2.abs()));
        boolean ok1 = r1.im() >= -tol;
        boolean ok2 = r2.im() >= -tol;
        Complex pick;
        if (ok1 && !ok2) {
            pick = r1;
        } else if (ok2 && !ok1) {
            pick = r2;
        } else {
            pick = r1.minus(mg).abs2() <= r2.minus(mg).abs2() ? r1 : r2;
        }
        out[0] = pick.re();
        out[1] = pick.im();
    }
}

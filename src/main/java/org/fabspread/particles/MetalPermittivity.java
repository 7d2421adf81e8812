package org.fabspread.particles;

import org.fabspread.optics.NkTable;

/**
 * Bulk metal permittivity with size-limited electron damping.
 *
 * <p>Small particles add surface scattering of the conduction electrons to the bulk damping
 * (Kreibig &amp; Vollmer, <i>Optical Properties of Metal Clusters</i>, 1995):
 * γ = γ₀ + Δγ, Δγ = A_s v_F / ℓ, with the effective mean free path ℓ = 4V/S (Coronado &amp; Schatz,
 * J. Chem. Phys. 119, 3926 (2003); ℓ = 4r/3 for a sphere; A_s = 1 in this convention). The free-electron
 * (Drude) part of the tabulated bulk permittivity is re-damped by adding, without cancellation,
 * Δε = i ω_p² Δγ / [ω (ω + iγ₀)(ω + iγ)], which is ε_Drude(γ) − ε_Drude(γ₀) exactly.
 *
 * <p>Units: the formula is a ratio of angular frequencies squared, so it is evaluated with all of ω,
 * ω_p, γ₀, Δγ expressed as energies ħω (eV); ħΔγ = ħ A_s v_F / ℓ with ħ = 6.582119569e-16 eV s. This is
 * the same number as the rad/s form (ω = E/ħ, no 2π).
 */
public final class MetalPermittivity {
    /** Reduced Planck constant, eV s (CODATA 2018, exact in the SI). */
    public static final double HBAR_EV_S = 6.582119569e-16;
    /** h c in eV nm (photon energy E = HC_EV_NM / λ). */
    public static final double HC_EV_NM = 2 * Math.PI * HBAR_EV_S * 299_792_458.0 * 1e9;

    private MetalPermittivity() {
    }

    /** Photon energy ħω (eV) at a vacuum wavelength (nm). */
    public static double photonEnergyEv(double lambdaNm) {
        return HC_EV_NM / lambdaNm;
    }

    /**
     * ħΔγ = ħ A_s v_F / ℓ (eV).
     *
     * @param meanFreePathNm  ℓ (nm); +∞ gives 0
     * @param fermiVelocityMs v_F (m/s)
     * @param surfaceScatteringA A_s (dimensionless, convention ℓ = 4V/S)
     */
    public static double surfaceDampingEv(double meanFreePathNm, double fermiVelocityMs, double surfaceScatteringA) {
        return HBAR_EV_S * surfaceScatteringA * fermiVelocityMs / (meanFreePathNm * 1e-9);
    }

    /**
     * Size-corrected permittivity ε + Δε written to {@code out[0]} (real) and {@code out[1]} (imaginary).
     * An infinite mean free path (or A_s = 0, v_F = 0) returns the input exactly.
     *
     * @param lambdaNm           vacuum wavelength (nm)
     * @param epsRe              bulk Re ε
     * @param epsIm              bulk Im ε
     * @param meanFreePathNm     ℓ = 4V/S (nm), &gt; 0, may be +∞
     * @param plasmaEnergyEv     ħω_p (eV)
     * @param bulkDampingEv      ħγ₀ (eV)
     * @param fermiVelocityMs    v_F (m/s)
     * @param surfaceScatteringA A_s
     * @param out                length ≥ 2
     */
    public static void sizeCorrected(double lambdaNm, double epsRe, double epsIm, double meanFreePathNm,
                                     double plasmaEnergyEv, double bulkDampingEv, double fermiVelocityMs,
                                     double surfaceScatteringA, double[] out) {
        if (!(meanFreePathNm > 0)) {
            throw new IllegalArgumentException("mean free path must be > 0 nm, got " + meanFreePathNm);
        }
        double dg = surfaceDampingEv(meanFreePathNm, fermiVelocityMs, surfaceScatteringA);
        if (dg == 0) {
            out[0] = epsRe;
            out[1] = epsIm;
            return;
        }
        double e = photonEnergyEv(lambdaNm);
        double g = bulkDampingEv + dg;
        // (E + iγ₀)(E + iγ) = (E² − γ₀γ) + iE(γ₀ + γ), times E
        double dr = e * (e * e - bulkDampingEv * g);
        double di = e * e * (bulkDampingEv + g);
        double num = plasmaEnergyEv * plasmaEnergyEv * dg;
        // i·num / (dr + i di) = num (di + i dr) / (dr² + di²)
        double den = dr * dr + di * di;
        out[0] = epsRe + num * di / den;
        out[1] = epsIm + num * dr / den;
    }

    /**
     * Surface area of an ellipsoid, exact: S = 3V R_G(a⁻², b⁻², c⁻²) with V = 4πabc/3 (NIST DLMF 19.33.1;
     * Carlson's R_G by duplication). A sphere returns 4πr² (to rounding).
     */
    public static double surfaceArea(double a, double b, double c) {
        checkAxes(a, b, c);
        double v = 4 * Math.PI * a * b * c / 3;
        return 3 * v * Carlson.rg(1 / (a * a), 1 / (b * b), 1 / (c * c));
    }

    /**
     * Effective mean free path ℓ = 4V/S of an ellipsoid (Coronado &amp; Schatz 2003), with the exact
     * surface area of {@link #surfaceArea} (not Thomsen's approximation, which errs by up to about 1 %):
     * ℓ = 4 / (3 R_G(a⁻², b⁻², c⁻²)). A sphere returns exactly 4r/3.
     */
    public static double meanFreePath(double a, double b, double c) {
        checkAxes(a, b, c);
        if (a == b && b == c) {
            return 4 * a / 3;
        }
        double s = Math.max(a, Math.max(b, c));
        double ua = a / s;
        double ub = b / s;
        double uc = c / s;
        return s * 4 / (3 * Carlson.rg(1 / (ua * ua), 1 / (ub * ub), 1 / (uc * uc)));
    }

    /**
     * ħω_p (eV) from a least-squares Drude fit to a metal's own n, k table, so that the size correction
     * uses the same free-electron strength as the bulk ε it corrects: over the table rows with
     * {@code minNm ≤ λ ≤ maxNm}, Re ε = ε_∞ − E_p² / (E² + ħγ₀²) is linear in u = 1/(E² + ħγ₀²); the slope
     * is −E_p². Choose a range where interband transitions are weak (Ag above about 500 nm, Au above
     * about 700 nm).
     *
     * @throws IllegalArgumentException when fewer than 3 rows lie in the range or the fit is not Drude-like
     */
    public static double fitPlasmaEnergy(NkTable table, double minNm, double maxNm, double bulkDampingEv) {
        double[] wl = table.wavelengths();
        double[] n = table.nValues();
        double[] k = table.kValues();
        double su = 0;
        double sy = 0;
        double suu = 0;
        double suy = 0;
        int m = 0;
        for (int i = 0; i < wl.length; i++) {
            if (wl[i] < minNm || wl[i] > maxNm) {
                continue;
            }
            double e = photonEnergyEv(wl[i]);
            double u = 1 / (e * e + bulkDampingEv * bulkDampingEv);
            double y = n[i] * n[i] - k[i] * k[i];
            su += u;
            sy += y;
            suu += u * u;
            suy += u * y;
            m++;
        }
        if (m < 3) {
            throw new IllegalArgumentException(table.id() + ": a Drude fit needs at least 3 table rows between "
                    + minNm + " and " + maxNm + " nm, found " + m);
        }
        double slope = (m * suy - su * sy) / (m * suu - su * su);
        if (!(slope < 0)) {
            throw new IllegalArgumentException(table.id() + ": Re ε does not fall like a free-electron metal between "
                    + minNm + " and " + maxNm + " nm; no plasma energy can be fitted");
        }
        return Math.sqrt(-slope);
    }

    private static void checkAxes(double a, double b, double c) {
        if (!(a > 0 && b > 0 && c > 0) || Double.isInfinite(a) || Double.isInfinite(b) || Double.isInfinite(c)) {
            throw new IllegalArgumentException("semi-axes must be finite and > 0, got " + a + ", " + b + ", " + c);
        }
    }
}

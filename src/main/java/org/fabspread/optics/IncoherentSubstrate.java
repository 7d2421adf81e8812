package org.fabspread.optics;

/**
 * A thick (incoherent) substrate in front of a coherent thin-film stack, by intensities: the light
 * bouncing between the air/glass interface and the stack is summed as a geometric series of
 * powers, without phase (Pettersson, Roman &amp; Inganäs, J. Appl. Phys. 86, 487 (1999); Katsidis &amp;
 * Siapkas, Appl. Opt. 41, 3978 (2002); Centurioni, Appl. Opt. 44, 7532 (2005)).
 *
 * <p>Notation: R<sub>ag</sub> the air/glass reflectance at normal incidence (equal from both sides),
 * T<sub>ag</sub> = 1 − R<sub>ag</sub>, t<sub>g</sub> = exp(−4πk<sub>g</sub>d<sub>g</sub>/λ) the single-pass
 * transmission of the glass, R<sub>c</sub>, T<sub>c</sub> the reflectance and transmittance of the
 * coherent stack seen from the glass (solved with n<sub>0</sub> = Re n<sub>glass</sub>), and
 * D = 1 − R<sub>ag</sub> R<sub>c</sub> t<sub>g</sub>². Together they close energy:
 * R + T + A<sub>glass</sub> + entryFactor·(1 − R<sub>c</sub> − T<sub>c</sub>) = 1.
 */
public final class IncoherentSubstrate {

    private IncoherentSubstrate() {
    }

    /** Normal-incidence Fresnel reflectance |(N1 − N2)/(N1 + N2)|² between two media (Born &amp; Wolf ch. 1.5). */
    public static double fresnelNormal(double n1Re, double n1Im, double n2Re, double n2Im) {
        final double aRe = n1Re - n2Re;
        final double aIm = n1Im - n2Im;
        final double bRe = n1Re + n2Re;
        final double bIm = n1Im + n2Im;
        return (aRe * aRe + aIm * aIm) / (bRe * bRe + bIm * bIm);
    }

    /** Single-pass intensity transmission of an absorbing slab, exp(−4πkd/λ). */
    public static double singlePass(double k, double dNm, double lambdaNm) {
        return Math.exp(-4 * Math.PI * k * dNm / lambdaNm);
    }

    /** Share of the incident power that reaches the coherent stack, summed over all passes: T_ag t_g / D. */
    public static double entryFactor(double rAg, double tG, double rC) {
        return (1 - rAg) * tG / (1 - rAg * rC * tG * tG);
    }

    /** Total reflectance R_ag + T_ag² t_g² R_c / D. */
    public static double totalReflectance(double rAg, double tG, double rC) {
        final double tAg = 1 - rAg;
        return rAg + tAg * tAg * tG * tG * rC / (1 - rAg * rC * tG * tG);
    }

    /** Total transmittance T_ag t_g T_c / D. */
    public static double totalTransmittance(double rAg, double tG, double rC, double tC) {
        return (1 - rAg) * tG * tC / (1 - rAg * rC * tG * tG);
    }

    /** Absorptance of the glass, T_ag (1 − t_g)(1 + R_c t_g) / D. */
    public static double glassAbsorptance(double rAg, double tG, double rC) {
        return (1 - rAg) * (1 - tG) * (1 + rC * tG) / (1 - rAg * rC * tG * tG);
    }
}

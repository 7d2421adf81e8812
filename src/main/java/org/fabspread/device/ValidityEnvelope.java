package org.fabspread.device;

/**
 * The limits of the particle optics' validity envelope and the pure tests against them (one per
 * {@link EnvelopeReason}). Samples outside the envelope are still computed; they are counted.
 *
 * <ul>
 * <li>Size parameter: the quasi-static polarisability and its modified long-wavelength correction hold for
 *   x = 2π n_h a / λ ≪ 1 (C. F. Bohren and D. R. Huffman, <i>Absorption and Scattering of Light by Small
 *   Particles</i>, Wiley 1983, §5.1–5.2; for the MLWA of spheroids, K. L. Kelly, E. Coronado, L. L. Zhao and
 *   G. C. Schatz, J. Phys. Chem. B 107, 668 (2003), and A. Moroz, J. Opt. Soc. Am. B 26, 517 (2009), whose
 *   comparisons with exact spheroid results show the dipole picture failing as x approaches 1). We take
 *   x ≤ 0.5 as the limit ("from memory"; cross-checked against this project's full Mie: the dipole-only
 *   sphere is about 15 % off at 40 nm silver in n = 1.5, where x ≈ 0.54 at 350 nm). Spheres are computed by
 *   full Mie theory, which has no size limit.</li>
 * <li>Volume fraction: Maxwell Garnett mixing assumes dilute, non-interacting inclusions (J. C. Maxwell
 *   Garnett, Phil. Trans. R. Soc. Lond. A 203, 385 (1904); V. A. Markel, J. Opt. Soc. Am. A 33, 1244 (2016)
 *   on its validity); above f ≈ 0.3 neighbour coupling dominates (the project's
 *   {@link org.fabspread.particles.EffectiveMedium#DENSE_LIMIT}, common practice).</li>
 * <li>Film: the particle layer's height 2c must not exceed the host film's thickness.</li>
 * <li>Monolayer: equal discs cover at most π/(2√3) ≈ 0.9069 of a plane (hexagonal packing; Thue's theorem,
 *   L. Fejes Tóth, <i>Lagerungen in der Ebene, auf der Kugel und im Raum</i>, Springer 1953); a larger
 *   projected-area coverage needs a second layer.</li>
 * </ul>
 */
public final class ValidityEnvelope {
    /** Largest size parameter x = 2π n_h a_max / λ of the small-particle approximations. */
    public static final double MAX_SIZE_PARAMETER = 0.5;
    /** Largest volume fraction of the effective layer. */
    public static final double MAX_VOLUME_FRACTION = org.fabspread.particles.EffectiveMedium.DENSE_LIMIT;
    /** Largest projected-area coverage of one layer of equal discs, π/(2√3). */
    public static final double MAX_MONOLAYER_COVERAGE = Math.PI / (2 * Math.sqrt(3));

    private ValidityEnvelope() {
    }

    /**
     * The largest semi-axis of a spheroid/ellipsoid of volume-equivalent diameter D with p = a/b ≥ 1 and
     * q = c/a: abc = (D/2)³, so a = (D/2)(p/q)^{1/3} and c = q a.
     */
    public static double largestSemiAxis(double diameterNm, double inPlaneAspect, double outOfPlaneAspect) {
        double a = 0.5 * diameterNm * Math.cbrt(inPlaneAspect / outOfPlaneAspect);
        return Math.max(a, outOfPlaneAspect * a);
    }

    /** The size parameter x = 2π n_h a / λ. */
    public static double sizeParameter(double semiAxisNm, double hostIndex, double wavelengthNm) {
        return 2 * Math.PI * hostIndex * semiAxisNm / wavelengthNm;
    }

    /** Whether a particle of this shape is computed by an approximation with a size limit (not a sphere). */
    public static boolean sizeLimited(double inPlaneAspect, double outOfPlaneAspect) {
        return !(inPlaneAspect == 1 && outOfPlaneAspect == 1);
    }

    /** {@link EnvelopeReason#SIZE_PARAMETER} for a size-limited approximation. */
    public static boolean beyondSize(double sizeParameter) {
        return sizeParameter > MAX_SIZE_PARAMETER;
    }

    /** {@link EnvelopeReason#VOLUME_FRACTION}. */
    public static boolean beyondFill(double volumeFraction) {
        return volumeFraction > MAX_VOLUME_FRACTION;
    }

    /** {@link EnvelopeReason#LARGER_THAN_FILM} (with the placement's rounding tolerance). */
    public static boolean largerThanFilm(double layerHeightNm, double filmNm) {
        return layerHeightNm > filmNm + 1e-9 * Math.max(1, filmNm);
    }

    /** {@link EnvelopeReason#BEYOND_MONOLAYER}. */
    public static boolean beyondMonolayer(double coverage) {
        return coverage > MAX_MONOLAYER_COVERAGE;
    }
}

package org.fabspread.particles;

/**
 * Where the light absorbed by the effective particle layer goes. The transfer matrix gives the
 * absorptance A_p of the homogenised layer; it is split per wavelength in proportion to these loss rates
 * per unit volume (ensemble averages, normalised to the intensity in the host):
 * <ul>
 *   <li>metal absorption (parasitic): n_V⟨σ_abs,metal⟩;</li>
 *   <li>scattering: n_V⟨σ_sca⟩;</li>
 *   <li>host absorption with the dipole near field on the host side:
 *       κ_h [(1 − f) + n_V⟨|α|²(1/(6π r_eq³) − s/(64π z₀³))⟩], κ_h = (2π/λ) Im ε_h / Re n_h; of it, when a
 *       quenching distance δ_q is set (host is an absorber), the part within δ_q of the metal, i.e. the
 *       host-side shell volume (capped at 1 − f) and the near-field integral over that shell, is
 *       quenched: absorbed without current;</li>
 *   <li>near field reaching a neighbouring absorber: κ_nb n_V⟨|α|²/(64π z₀³)⟩,
 *       κ_nb = (2π/λ) Im ε_nb / Re n_h (s = 1 when there is one).</li>
 * </ul>
 * Derivation of the near-field terms: an in-plane dipole gives |E/E₀|² = |α|²(1 + 3cos²ψ)/(16π² r⁶)
 * with the α convention of {@link Polarizability}; ∫(1 + 3cos²ψ) r⁻⁶ dV is 8π/(3 r_eq³) over r &gt; r_eq
 * and π/(4 z₀³) over the half-space beyond z₀. Half of the latter is the field component normal to the
 * interface, which the ignored dielectric contrast would reduce (roughly by |ε_h/ε_nb|²), and the image
 * field of the interface is ignored: a dipole estimate (model document, section 4.5).
 *
 * <p>"hostUseful" is the host's absorption outside the quenching shells: useful current when the host is
 * an absorber, parasitic when it is a transport layer; the caller knows which.
 *
 * @param metal              absorbed in the metal
 * @param scattering         scattered out of the coherent beam
 * @param hostUseful         absorbed in the host outside the quenching shells
 * @param hostQuenched       absorbed in the host within δ_q of the metal
 * @param neighbourNearField absorbed in a neighbouring absorber through the near field
 */
public record LossSplit(double metal, double scattering, double hostUseful, double hostQuenched,
                        double neighbourNearField) {
    /** Index of the metal part in the rate and part arrays. */
    public static final int METAL = 0;
    public static final int SCATTERING = 1;
    public static final int HOST_USEFUL = 2;
    public static final int HOST_QUENCHED = 3;
    public static final int NEIGHBOUR = 4;
    /** Length of the rate and part arrays. */
    public static final int PARTS = 5;

    /** The sum of the parts (equal to the split absorptance up to one rounding). */
    public double total() {
        return metal + scattering + hostUseful + hostQuenched + neighbourNearField;
    }

    /**
     * The five loss rates per unit volume (nm⁻¹) at the ensemble's last computed wavelength.
     * Allocation-free.
     *
     * @param e               an ensemble after {@link ParticleEnsemble#compute}
     * @param pol             {@link ParticleEnsemble#AXIS_A}, {@link ParticleEnsemble#AXIS_B} or
     *                        {@link ParticleEnsemble#UNPOLARIZED}
     * @param neighbourEpsIm  Im ε of the neighbouring absorber (ignored without one)
     * @param rates           receives {@link #PARTS} rates
     */
    public static void rates(ParticleEnsemble e, int pol, double neighbourEpsIm, double[] rates) {
        double lambda = e.wavelength();
        double nv = e.numberPerVolume();
        double f = Math.min(1, e.volumeFraction());
        double nh = e.hostIndexRe();
        double kh = 2 * Math.PI / lambda * e.hostIm() / nh;
        rates[METAL] = nv * e.metalAbsorption(pol);
        rates[SCATTERING] = nv * e.scattering(pol);
        double host = kh * ((1 - f) + nv * e.nearFieldHost(pol));
        double quenched = 0;
        if (e.quenchDistance() > 0) {
            quenched = kh * (Math.min(nv * e.quenchShellVolume(), 1 - f) + nv * e.nearFieldQuenched(pol));
            quenched = Math.min(quenched, host);
        }
        rates[HOST_USEFUL] = Math.max(0, host - quenched);
        rates[HOST_QUENCHED] = Math.max(0, quenched);
        rates[NEIGHBOUR] = e.hasNeighbour() ? Math.max(0, 2 * Math.PI / lambda * neighbourEpsIm / nh * nv
                * e.nearFieldNeighbour(pol)) : 0;
    }

    /**
     * Splits the absorptance in proportion to the rates. The parts are ≥ 0 and sum to A_p: the largest
     * part is A_p minus the others. All rates zero puts the whole of A_p on the metal. A_p &lt; 0 by at most
     * 1e-9 (transfer-matrix rounding) is read as 0. {@code parts} may be the {@code rates} array.
     *
     * @param absorptance A_p of the effective layer
     * @param rates       {@link #PARTS} non-negative rates
     * @param parts       receives {@link #PARTS} parts
     */
    public static void split(double absorptance, double[] rates, double[] parts) {
        if (!(absorptance >= -1e-9) || Double.isInfinite(absorptance)) {
            throw new IllegalArgumentException("absorptance must be finite and >= 0, got " + absorptance);
        }
        double ap = Math.max(0, absorptance);
        double sum = 0;
        for (int i = 0; i < PARTS; i++) {
            if (!(rates[i] >= 0) || Double.isInfinite(rates[i])) {
                throw new IllegalArgumentException("loss rates must be finite and >= 0, got " + rates[i]);
            }
            sum += rates[i];
        }
        if (sum == 0) {
            for (int i = 0; i < PARTS; i++) {
                parts[i] = 0;
            }
            parts[METAL] = ap;
            return;
        }
        int largest = 0;
        for (int i = 1; i < PARTS; i++) {
            if (rates[i] > rates[largest]) {
                largest = i;
            }
        }
        double others = 0;
        for (int i = 0; i < PARTS; i++) {
            if (i != largest) {
                parts[i] = ap * (rates[i] / sum);
                others += parts[i];
            }
        }
        parts[largest] = Math.max(0, ap - others);
    }

    /** The split as a record (allocates). */
    public static LossSplit of(double absorptance, double[] rates) {
        double[] p = new double[PARTS];
        split(absorptance, rates, p);
        return new LossSplit(p[METAL], p[SCATTERING], p[HOST_USEFUL], p[HOST_QUENCHED], p[NEIGHBOUR]);
    }
}

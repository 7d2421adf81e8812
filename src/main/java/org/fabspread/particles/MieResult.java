package org.fabspread.particles;

import java.util.List;

/**
 * Efficiencies and coefficients of Mie scattering by a homogeneous sphere (Bohren &amp; Huffman 1983,
 * ch. 4 and app. A).
 *
 * @param x     size parameter 2π n_host r / λ
 * @param qExt  extinction efficiency
 * @param qSca  scattering efficiency
 * @param qBack backscattering efficiency in Bohren &amp; Huffman's convention,
 *              |Σ (2n+1)(−1)ⁿ (a_n − b_n)|² / x²
 * @param g     asymmetry parameter ⟨cos θ⟩
 * @param a     electric coefficients a_1 … a_N (index 0 holds a_1)
 * @param b     magnetic coefficients b_1 … b_N
 */
public record MieResult(double x, double qExt, double qSca, double qBack, double g, List<Complex> a, List<Complex> b) {
    public MieResult {
        a = List.copyOf(a);
        b = List.copyOf(b);
    }

    /** Absorption efficiency Q_ext − Q_sca. */
    public double qAbs() {
        return qExt - qSca;
    }

    /** The electric dipole coefficient a_1. */
    public Complex a1() {
        return a.get(0);
    }

    /** The magnetic dipole coefficient b_1. */
    public Complex b1() {
        return b.get(0);
    }

    /** Number of terms of the series. */
    public int terms() {
        return a.size();
    }
}

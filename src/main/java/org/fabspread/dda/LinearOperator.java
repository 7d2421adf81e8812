package org.fabspread.dda;

/** y = A x for complex vectors held as separate real and imaginary arrays. */
interface LinearOperator {
    void apply(double[] xr, double[] xi, double[] yr, double[] yi);
}

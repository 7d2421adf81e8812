package org.fabspread.particles;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;

import org.apache.commons.math3.analysis.integration.gauss.GaussIntegrator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory;
import org.fabspread.optics.MaterialLibrary;
import org.fabspread.optics.NkTable;
import org.junit.jupiter.api.Test;

class LossSplitTest {
    private static final NkTable AG = MaterialLibrary.bundled().get("ag-johnson-christy");
    private static final GaussIntegrator GL = new GaussIntegratorFactory().legendre(40, 0, 1);

    /** ∫ f over [0,1] by panels of Gauss–Legendre. */
    private static double integrate(java.util.function.DoubleUnaryOperator f, int panels) {
        double s = 0;
        for (int i = 0; i < panels; i++) {
            for (int p = 0; p < GL.getNumberOfPoints(); p++) {
                s += GL.getWeight(p) * f.applyAsDouble((i + GL.getPoint(p)) / panels);
            }
        }
        return s / panels;
    }

    @Test
    void dipoleNearFieldIntegrals() {
        // source: model document 4.5: ∫(1 + 3cos²ψ) r⁻⁶ dV over r > r_eq is 8π/(3 r_eq³) and over the
        // half-space beyond z₀ is π/(4 z₀³) (in-plane dipole along x, plane normal z); integrated numerically
        double req = 7;
        // exterior of the sphere: r = req/u, u in (0,1]; angles by quadrature
        double ext = integrate(u -> {
            double r = req / u;
            double jac = req / (u * u);
            double ang = integrate(c -> integrate(ph -> {
                double cosT = 2 * c - 1;
                double sinT = Math.sqrt(1 - cosT * cosT);
                double cosPsi = sinT * Math.cos(2 * Math.PI * ph);
                return (1 + 3 * cosPsi * cosPsi) * 2 * 2 * Math.PI;
            }, 2), 2);
            return ang * Math.pow(r, -4) * jac;
        }, 4);
        assertEquals(8 * Math.PI / (3 * req * req * req), ext, 1e-10 * ext);
        // half-space z > z₀, cylindrical: x² averaged over the azimuth is ρ²/2
        double z0 = 9;
        double half = integrate(uz -> {
            double z = z0 / uz;
            double jz = z0 / (uz * uz);
            return jz * integrate(t -> {
                double rho = t / (1 - t + 1e-300);
                double jr = 1 / ((1 - t) * (1 - t) + 1e-300);
                double r2 = rho * rho + z * z;
                return jr * 2 * Math.PI * rho * (1 + 1.5 * rho * rho / r2) / (r2 * r2 * r2);
            }, 20);
        }, 10);
        assertEquals(Math.PI / (4 * z0 * z0 * z0), half, 1e-8 * half);
        // the closed-form tail of the half-space beyond a sphere of radius R ≥ z₀ (used for the quenching
        // shell); at R = z₀ it is the whole half-space
        assertEquals(Math.PI / (4 * z0 * z0 * z0), NearFieldIntegrals.tail(z0, z0), 1e-15);
        double rr = 13;
        double tail = integrate(u -> {
            double r = rr / u;
            double jac = rr / (u * u);
            double t = z0 / r;
            // ∫ over μ from t to 1 of 2π(1 + 1.5(1 − μ²)) dμ, by quadrature
            double ang = (1 - t) * integrate(m -> {
                double mu = t + (1 - t) * m;
                return 2 * Math.PI * (1 + 1.5 * (1 - mu * mu));
            }, 2);
            return ang * Math.pow(r, -4) * jac;
        }, 4);
        assertEquals(tail, NearFieldIntegrals.tail(z0, rr), 1e-10 * tail);
    }

    @Test
    void nearFieldTermsMatchTheDocumentForm() {
        // source: model document 4.5: host near field n_V⟨|α|²(1/(6π r_eq³) − s/(64π z₀³))⟩ and the neighbour
        // share ⟨|α|²/(64π z₀³)⟩, from |E|² = |α|²|E₀|²(1 + 3cos²ψ)/(16π² r⁶)
        double lam = 440;
        double n = AG.n(lam);
        double k = AG.k(lam);
        ParticleEnsemble e = new ParticleEnsemble().setShape(30, 0.25, 1.2, 0.8, 0.2).setMetal(9.01, 0.021, 1.39e6, 1);
        // in a loss-free host the near-field cap (ExactSums) does not apply: the document's form exactly
        e.compute(lam, n * n - k * k, 2 * n * k, 3.0, 0, 1, 0);
        for (int pol = 0; pol < 3; pol++) {
            double expectHost = e.alpha2OverR3(pol) / (6 * Math.PI) - e.alpha2OverZ03(pol) / (64 * Math.PI);
            assertEquals(expectHost, e.nearFieldHost(pol), 1e-12 * expectHost);
            assertEquals(e.alpha2OverZ03(pol) / (64 * Math.PI), e.nearFieldNeighbour(pol), 1e-12 * expectHost);
        }
        // in an absorbing host the host's near-field share is at most the document's form (it is capped by the
        // energy the particles remove from the field)
        e.compute(lam, n * n - k * k, 2 * n * k, 3.0, 0.4, 1, 0);
        for (int pol = 0; pol < 3; pol++) {
            double form = e.alpha2OverR3(pol) / (6 * Math.PI) - e.alpha2OverZ03(pol) / (64 * Math.PI);
            assertTrue(e.nearFieldHost(pol) <= form * (1 + 1e-12), "pol " + pol);
            assertEquals(e.alpha2OverZ03(pol) / (64 * Math.PI), e.nearFieldNeighbour(pol), 1e-12 * form);
        }
    }

    @Test
    void partsAreNonNegativeAndSumToTheAbsorptance() {
        // source: model document 4.5: "The split closes energy by construction"
        SplittableRandom rnd = new SplittableRandom(7);
        double[] rates = new double[LossSplit.PARTS];
        double[] parts = new double[LossSplit.PARTS];
        for (int trial = 0; trial < 2000; trial++) {
            double lam = 350 + 500 * rnd.nextDouble();
            double n = AG.n(lam);
            double k = AG.k(lam);
            double hIm = rnd.nextBoolean() ? 0 : rnd.nextDouble();
            double z0 = rnd.nextBoolean() ? Double.POSITIVE_INFINITY : 1 + 40 * rnd.nextDouble();
            double dq = rnd.nextBoolean() ? 0 : 10 * rnd.nextDouble();
            ParticleEnsemble e = new ParticleEnsemble().setShape(10 + 60 * rnd.nextDouble(), 0.4 * rnd.nextDouble(),
                    1 + rnd.nextDouble(), 0.3 + rnd.nextDouble(), 0.5 * rnd.nextDouble());
            e.compute(lam, n * n - k * k, 2 * n * k, 2 + 2 * rnd.nextDouble(), hIm, z0, dq);
            LossSplit.rates(e, rnd.nextInt(3), rnd.nextDouble() * 2, rates);
            double ap = rnd.nextDouble() * 0.3;
            LossSplit.split(ap, rates, parts);
            double sum = 0;
            for (double p : parts) {
                assertTrue(p >= 0);
                sum += p;
            }
            assertEquals(ap, sum, 4 * Math.ulp(ap));
            LossSplit rec = LossSplit.of(ap, rates);
            assertEquals(ap, rec.total(), 4 * Math.ulp(ap));
            if (hIm == 0) {
                assertEquals(0, rec.hostUseful(), 0);
                assertEquals(0, rec.hostQuenched(), 0);
            }
            if (Double.isInfinite(z0)) {
                assertEquals(0, rec.neighbourNearField(), 0);
            }
            if (dq == 0) {
                assertEquals(0, rec.hostQuenched(), 0);
            }
        }
        LossSplit zero = LossSplit.of(0.02, new double[LossSplit.PARTS]);
        assertEquals(0.02, zero.metal(), 0);
    }

    @Test
    void quenchingGrowsWithDistanceAndIsCapped() {
        // common practice: a larger quenching distance takes a larger share of the host's absorption, never
        // more than all of it
        double lam = 480;
        double n = AG.n(lam);
        double k = AG.k(lam);
        double[] rates = new double[LossSplit.PARTS];
        double prev = 0;
        ParticleEnsemble e = new ParticleEnsemble().setShape(30, 0.2, 1, 1, 0.3);
        for (double dq : new double[] {1, 3, 10, 30, 300}) {
            e.compute(lam, n * n - k * k, 2 * n * k, 3.5, 0.8, Double.POSITIVE_INFINITY, dq);
            LossSplit.rates(e, ParticleEnsemble.UNPOLARIZED, 0, rates);
            double share = rates[LossSplit.HOST_QUENCHED] / (rates[LossSplit.HOST_QUENCHED] + rates[LossSplit.HOST_USEFUL]);
            assertTrue(share > prev && share <= 1);
            prev = share;
        }
        assertEquals(1, prev, 1e-3);
    }
}

package org.fabspread.particles;

import java.util.concurrent.ConcurrentHashMap;

import org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory;
import org.apache.commons.math3.analysis.integration.gauss.SymmetricGaussIntegrator;

/**
 * Gauss–Hermite rules for the weight e^{−x²} (commons-math3 {@code HermiteRuleFactory}), cached per
 * node count and handed out as nodes x_i with probability weights w_i/√π renormalised to sum to 1, so
 * that E[g(Z)] for a standard normal Z is Σ w_i g(√2 x_i).
 */
public final class GaussHermite {
    private static final ConcurrentHashMap<Integer, GaussHermite> CACHE = new ConcurrentHashMap<>();
    private final double[] nodes;
    private final double[] weights;

    private GaussHermite(int n) {
        SymmetricGaussIntegrator rule = new GaussIntegratorFactory().hermite(n);
        nodes = new double[n];
        weights = new double[n];
        double sum = 0;
        for (int i = 0; i < n; i++) {
            nodes[i] = rule.getPoint(i);
            weights[i] = rule.getWeight(i) / Math.sqrt(Math.PI);
            sum += weights[i];
        }
        for (int i = 0; i < n; i++) {
            weights[i] /= sum;
        }
    }

    /** The rule with {@code n} nodes (1 … 400). */
    public static GaussHermite of(int n) {
        if (n < 1 || n > 400) {
            throw new IllegalArgumentException("Gauss–Hermite node count must be 1..400, got " + n);
        }
        return CACHE.computeIfAbsent(n, GaussHermite::new);
    }

    public int size() {
        return nodes.length;
    }

    /** Node x_i of the weight e^{−x²}. */
    public double node(int i) {
        return nodes[i];
    }

    /** Probability weight w_i/√π (renormalised so the weights sum to 1). */
    public double weight(int i) {
        return weights[i];
    }
}

package org.fabspread.analysis;

/**
 * Process capability of one output against a one-sided spec.
 *
 * @param output        output id
 * @param spec          the target in words
 * @param n             samples used
 * @param mean          sample mean μ
 * @param sd            sample standard deviation σ (divisor n − 1)
 * @param cpk           (μ − LSL)/(3σ) for a lower spec, (USL − μ)/(3σ) for an upper one
 * @param normalYield   Φ(3 C_pk), the yield if the output were normal
 * @param observedYield the counted fraction meeting the spec, to set beside it
 * @param skewness      adjusted sample skewness G1
 * @param caveat        what the skewness does to Φ(3 C_pk); empty when it is not notable
 */
public record Capability(String output, String spec, int n, double mean, double sd, double cpk, double normalYield,
                         double observedYield, double skewness, String caveat) {
}

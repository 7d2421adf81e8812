package org.fabspread.analysis;

import java.util.List;

/**
 * A named set of inputs whose variance is attributed together: a closed first-order index S_G^c (the
 * share of Var E[Y | X_G]) and a total index S_TG (the share of E Var(Y | X_−G)) per group (Sobol,
 * Math. Comput. Simul. 55, 271 (2001); Saltelli et al., Global Sensitivity Analysis: The Primer (2008),
 * sec. 4.6). A group of correlated inputs is independent of the rest, so its indices do not depend on
 * how the inputs inside it are ordered.
 *
 * @param name   the group's name (the study's, or "correlated: a + b" for a correlated set)
 * @param inputs the member input ids, at least one
 */
public record InputGroup(String name, List<String> inputs) {

    public InputGroup {
        inputs = List.copyOf(inputs);
        if (inputs.isEmpty()) {
            throw new IllegalArgumentException("group '" + name + "' has no inputs");
        }
    }

    /** The groups of correlated inputs (connected components of the correlation), named by their members. */
    public static List<InputGroup> correlated(GaussianCopula copula) {
        return copula.correlatedGroups().stream()
                .map(g -> new InputGroup("correlated: " + String.join(" + ", g), g)).toList();
    }
}

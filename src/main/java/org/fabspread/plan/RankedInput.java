package org.fabspread.plan;

/**
 * One entry of the sensitivity ranking handed to the plan advisor: an input id and its total-order
 * (Sobol) index, the share of the output variance it is involved in.
 */
public record RankedInput(String id, double totalIndex) {
}

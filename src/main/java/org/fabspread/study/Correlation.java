package org.fabspread.study;

/** A Spearman rank correlation target between two uncertain inputs. */
public record Correlation(String first, String second, double spearman, SourceLocation where) {
}

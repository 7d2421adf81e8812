package org.fabspread.plan;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.List;

import org.junit.jupiter.api.Test;

class TwoLevelDesignTest {

    @Test
    void wordLengthPatternFromGeneratorsAgreesWithTheMatrixForEveryTabledDesign() {
        for (int runs : MinimumAberrationCatalog.RUN_SIZES) {
            for (int k = 1; k <= MinimumAberrationCatalog.MAX_FACTORS; k++) {
                if (!MinimumAberrationCatalog.covers(k, runs)) {
                    continue;
                }
                TwoLevelDesign d = MinimumAberrationCatalog.design(k, runs);
                assertEquals(runs, d.runs());
                int[] fromMatrix = TwoLevelDesign.wordLengthPatternFromMatrix(d.matrix());
                assertArrayEquals(d.wordLengthPattern(), fromMatrix, d.toString());
                assertEquals((1 << d.fraction()) - 1, d.words().length);
            }
        }
    }

    @Test
    void tabledDesignsHaveTheMinimumWordLengthPatternOfAnExhaustiveSearch() {
        // source: NIST/SEMATECH e-Handbook 5.3.3.4.7 and Montgomery's table of 2^(k-p) designs (generators
        // from memory); cross-checked here a second way: minimum aberration is defined (Fries & Hunter,
        // Technometrics 22, 601 (1980)) as the lexicographically smallest word-length pattern among all
        // regular fractions of that size, which the exhaustive search finds independently.
        for (int runs : MinimumAberrationCatalog.RUN_SIZES) {
            for (int k = 1; k <= MinimumAberrationCatalog.MAX_FACTORS; k++) {
                if (!MinimumAberrationCatalog.covers(k, runs) || (1 << k) == runs) {
                    continue;
                }
                TwoLevelDesign tabled = MinimumAberrationCatalog.design(k, runs);
                TwoLevelDesign searched = MinimumAberrationCatalog.searchMinimumAberration(k, runs);
                assertArrayEquals(searched.wordLengthPattern(), tabled.wordLengthPattern(),
                        k + " factors in " + runs + " runs: tabled " + tabled + " searched " + searched);
            }
        }
    }

    @Test
    void resolutionsMatchThePublishedTable() {
        // source: NIST/SEMATECH e-Handbook of Statistical Methods, 5.3.3.4.7, summary table of fractional
        // factorial designs (resolution of each run size and factor count)
        int[][] expected = {
                // runs, k, resolution
                {8, 4, 4}, {8, 5, 3}, {8, 6, 3}, {8, 7, 3},
                {16, 5, 5}, {16, 6, 4}, {16, 7, 4}, {16, 8, 4}, {16, 9, 3}, {16, 10, 3}, {16, 11, 3},
                {32, 6, 6}, {32, 7, 4}, {32, 8, 4}, {32, 9, 4}, {32, 10, 4}, {32, 11, 4},
                {64, 7, 7}, {64, 8, 5}, {64, 9, 4}, {64, 10, 4}, {64, 11, 4},
                {128, 8, 8}, {128, 9, 6}, {128, 10, 5}, {128, 11, 5}};
        for (int[] e : expected) {
            TwoLevelDesign d = MinimumAberrationCatalog.design(e[1], e[0]);
            assertEquals(e[2], d.resolution(), d.toString());
        }
    }

    @Test
    void wordLengthPatternsOfSomeWellKnownFractions() {
        // from memory (Chen, Sun & Wu, Int. Stat. Rev. 61, 131 (1993), minimum-aberration catalogue);
        // cross-checked above against the exhaustive search and the design matrix
        assertArrayEquals(new int[]{0, 0, 0, 7, 7, 0, 0, 1}, MinimumAberrationCatalog.design(7, 8).wordLengthPattern());
        assertArrayEquals(new int[]{0, 0, 0, 0, 3, 0, 0}, MinimumAberrationCatalog.design(6, 16).wordLengthPattern());
        assertArrayEquals(new int[]{0, 0, 0, 0, 14, 0, 0, 0, 1}, MinimumAberrationCatalog.design(8, 16).wordLengthPattern());
        assertArrayEquals(new int[]{0, 0, 0, 0, 1, 2, 0, 0}, MinimumAberrationCatalog.design(7, 32).wordLengthPattern());
        assertArrayEquals(new int[]{0, 0, 0, 0, 6, 8, 0, 0, 1, 0}, MinimumAberrationCatalog.design(9, 32).wordLengthPattern());
    }

    @Test
    void isomorphicGeneratorSetsGiveTheSamePattern() {
        // common practice: relabelling factors or choosing another isomorphic generator set leaves the
        // word-length pattern unchanged
        TwoLevelDesign a = TwoLevelDesign.fromGenerators(6, "E=ABC", "F=BCD");
        TwoLevelDesign b = TwoLevelDesign.fromGenerators(6, "E=ABD", "F=ACD");
        assertArrayEquals(a.wordLengthPattern(), b.wordLengthPattern());
        TwoLevelDesign c = a.permute(new int[]{5, 4, 3, 2, 1, 0});
        assertArrayEquals(a.wordLengthPattern(), c.wordLengthPattern());
        assertArrayEquals(c.wordLengthPattern(), TwoLevelDesign.wordLengthPatternFromMatrix(c.matrix()));
    }

    @Test
    void aliasStructureOfTheHalfFractionOfFourFactors() {
        // source: Montgomery, Design and Analysis of Experiments, 2^(4-1) with I = ABCD:
        // main effects clear of 2fi; AB = CD, AC = BD, AD = BC
        AliasStructure s = TwoLevelDesign.fromGenerators(4, "D=ABC").aliasStructure();
        assertEquals("I = ABCD", s.definingRelation());
        assertEquals(4, s.resolution());
        for (AliasStructure.AliasChain c : s.mainEffects()) {
            assertTrue(c.aliases().isEmpty(), c.text());
        }
        assertEquals(List.of("AB + CD", "AC + BD", "AD + BC"),
                s.interactions().stream().map(AliasStructure.AliasChain::text).toList());
        assertEquals(List.of("A", "B", "C", "D"), s.clearMainEffects());
        assertTrue(s.clearInteractions().isEmpty());
    }

    @Test
    void aliasStructureOfTheQuarterFractionOfFiveFactors() {
        // source: Montgomery, Design and Analysis of Experiments, 2^(5-2) with D = AB, E = AC:
        // I = ABD = ACE = BCDE; A = BD = CE
        TwoLevelDesign d = TwoLevelDesign.fromGenerators(5, "D=AB", "E=AC");
        AliasStructure s = d.aliasStructure();
        assertEquals("I = ABD = ACE = BCDE", s.definingRelation());
        assertEquals("A + BD + CE", s.mainEffects().get(0).text());
        assertEquals("B + AD", s.mainEffects().get(1).text());
        assertEquals(List.of("BC + DE", "BE + CD"),
                s.interactions().stream().map(AliasStructure.AliasChain::text).toList());
        assertTrue(s.clearMainEffects().isEmpty());
    }

    @Test
    void minimumAberrationIsNotTheMostClearInteractions() {
        // source: statistics-and-doe.md "Experiment plans" (Wu & Hamada, Experiments, ch. 5): for 2^(9-4)
        // the minimum-aberration design has 8 clear two-factor interactions, another design 15
        assertEquals(8, MinimumAberrationCatalog.design(9, 32).clearTwoFactorInteractions().size());
        TwoLevelDesign most = MinimumAberrationCatalog.searchMostClearInteractions(9, 32, 4);
        assertEquals(15, most.clearTwoFactorInteractions().size());
        assertEquals(4, most.resolution());
    }

    @Test
    void searchKeepsNamedInteractionsClear() {
        // common practice: in the 2^(6-2) minimum-aberration design no 2fi is clear; in 32 runs the
        // 2^(8-3) keeps some clear; ask for A×B and C×D and check they are clear in the answer
        List<int[]> wanted = List.of(new int[]{0, 1}, new int[]{2, 3}, new int[]{0, 7});
        TwoLevelDesign d = MinimumAberrationCatalog.searchWithClear(8, 32, 4, wanted, Long.MAX_VALUE).orElseThrow();
        List<Integer> clear = d.clearTwoFactorInteractions();
        assertTrue(clear.contains(0b11), d.aliasStructure().text(null));
        assertTrue(clear.contains(0b1100));
        assertTrue(clear.contains(0b10000001));
        assertEquals(4, d.resolution());
        assertArrayEquals(d.wordLengthPattern(), TwoLevelDesign.wordLengthPatternFromMatrix(d.matrix()));
        // none keeps a 2fi clear in 16 runs for 6 factors at resolution IV
        assertTrue(MinimumAberrationCatalog.searchWithClear(6, 16, 4, List.of(new int[]{0, 1}), Long.MAX_VALUE).isEmpty());
    }

    @Test
    void matrixIsBalancedAndOrthogonal() {
        // common practice: every column of a regular two-level design is balanced and pairwise orthogonal
        int[][] m = MinimumAberrationCatalog.design(11, 16).matrix();
        for (int i = 0; i < 11; i++) {
            int sum = 0;
            for (int[] row : m) {
                sum += row[i];
            }
            assertEquals(0, sum);
            for (int j = i + 1; j < 11; j++) {
                int dot = 0;
                for (int[] row : m) {
                    dot += row[i] * row[j];
                }
                assertEquals(0, dot);
            }
        }
        // first run of the standard order: all base factors low, a generated factor is (-1)^(generator length):
        // E = ABC, F = BCD, G = ACD, H = ABD low; J = ABCD, K = AB, L = AC high
        assertEquals(Arrays.toString(new int[]{-1, -1, -1, -1, -1, -1, -1, -1, 1, 1, 1}), Arrays.toString(m[0]));
    }
}

package org.fabspread.plan;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.Test;

class PlanTest {

    private static List<Factor> factors(int k) {
        List<Factor> f = new ArrayList<>();
        for (int i = 0; i < k; i++) {
            f.add(new Factor("x" + i, "nm", 10, 1, 8, 12, "test"));
        }
        return f;
    }

    @Test
    void blocksOfAFullFactorialAvoidMainEffectsAndTwoFactorInteractions() {
        // source: Montgomery, Design and Analysis of Experiments, 2^5 in four blocks: block generators can be
        // chosen so that only interactions of three or more factors are confounded with blocks
        TwoLevelDesign d = TwoLevelDesign.full(5);
        Blocking b = Blocking.choose(d, 4);
        assertTrue(b.confoundedMain().isEmpty());
        assertTrue(b.confounded2fi().isEmpty());
        for (String w : b.confoundedWith()) {
            assertTrue(w.length() >= 3, w);
        }
        Plan p = Plan.build(CodedDesign.of(d), factors(5), 1, 4, 4, 3L);
        int[] perBlock = new int[4];
        int prevBlock = 1;
        for (Run r : p.runs()) {
            perBlock[r.block() - 1]++;
            assertTrue(r.block() >= prevBlock, "blocks are run one after another");
            prevBlock = r.block();
        }
        // 32 runs / 4 blocks + one centre point per block
        for (int n : perBlock) {
            assertEquals(9, n);
        }
        // every block is balanced in every factor (the block contrasts are interactions, not main effects)
        for (int blk = 1; blk <= 4; blk++) {
            for (int i = 0; i < 5; i++) {
                double s = 0;
                for (Run r : p.runs()) {
                    if (r.block() == blk) {
                        s += r.level(i);
                    }
                }
                assertEquals(0, s, 1e-12);
            }
        }
    }

    @Test
    void randomisedOrderIsReproducibleFromTheSeedAndKeepsEveryPoint() {
        // common practice: the run order is a permutation of the standard order, fixed by the seed
        CodedDesign d = CodedDesign.of(MinimumAberrationCatalog.design(6, 16));
        Plan a = Plan.build(d, factors(6), 2, 3, 1, 99L);
        Plan b = Plan.build(d, factors(6), 2, 3, 1, 99L);
        Plan c = Plan.build(d, factors(6), 2, 3, 1, 100L);
        assertEquals(35, a.size());
        List<Integer> sa = a.runs().stream().map(Run::standardOrder).toList();
        assertEquals(sa, b.runs().stream().map(Run::standardOrder).toList());
        assertNotEquals(sa, c.runs().stream().map(Run::standardOrder).toList());
        Map<Integer, Integer> count = new HashMap<>();
        for (Run r : a.runs()) {
            count.merge(r.standardOrder(), 1, Integer::sum);
            assertEquals(a.runs().indexOf(r) + 1, r.runOrder());
        }
        for (int s = 1; s <= 16; s++) {
            assertEquals(2, count.get(s));
        }
        assertEquals(3, a.runs().stream().filter(r -> r.type() == Run.PointType.CENTRE).count());
        // real units: coded -1/+1 at 8/12
        Run first = a.inStandardOrder().get(0);
        assertEquals(8, a.real(first, 0), 1e-12);
    }

    @Test
    void centralCompositeBlocksSplitCubeAndAxialPoints() {
        // source: Box & Hunter (1957): a CCD is run as a cube block and an axial block
        CodedDesign d = CodedDesign.centralComposite(3, ResponseSurfaceDesigns.Axial.FACE_CENTRED);
        Plan p = Plan.build(d, factors(3), 1, 4, 2, 1L);
        for (Run r : p.runs()) {
            if (r.type() == Run.PointType.AXIAL) {
                assertEquals(2, r.block());
            } else if (r.type() == Run.PointType.FACTORIAL) {
                assertEquals(1, r.block());
            }
        }
        assertThrows(IllegalArgumentException.class,
                () -> Plan.build(CodedDesign.boxBehnken(3), factors(3), 1, 0, 3, 1L));
        // Box-Behnken blocked by replicates
        Plan bb = Plan.build(CodedDesign.boxBehnken(3), factors(3), 2, 0, 2, 1L);
        assertEquals(24, bb.size());
        assertTrue(bb.runs().stream().allMatch(r -> r.block() == r.replicate()));
    }
}

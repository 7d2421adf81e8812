package org.fabspread.plan;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.PermutationSampler;
import org.apache.commons.rng.simple.RandomSource;

/**
 * An experiment plan ready to run: the coded design, the factors in real units, and the runs with
 * centre points, replicates and blocks added and the order randomised from a seed. Runs are listed
 * in run order.
 *
 * <p>Centre points: {@code centrePoints} in total, spread over the blocks as evenly as possible.
 * Replicates repeat every design point. Blocks: for regular two-level designs 2^q blocks from block
 * generators ({@link Blocking}); for a central composite design two blocks put the cube (with its
 * share of centre points) in the first and the axial points in the second; otherwise, when the
 * replicates are a multiple of the blocks, each block holds whole replicates. Randomisation is
 * complete within each block (a Fisher–Yates shuffle from Commons RNG seeded with {@code seed}).
 */
public record Plan(CodedDesign design, List<Factor> factors, int replicates, int centrePoints, int blocks,
                   Blocking blocking, long seed, List<Run> runs) {

    public Plan {
        factors = List.copyOf(factors);
        runs = List.copyOf(runs);
    }

    /** Factor ids in design order. */
    public List<String> factorIds() {
        return factors.stream().map(Factor::id).toList();
    }

    public int size() {
        return runs.size();
    }

    /** The setting of factor i in a run: its real value rounded to the factor's precision. */
    public double real(Run r, int i) {
        return factors.get(i).setting(r.level(i));
    }

    /** Builds the plan. */
    public static Plan build(CodedDesign design, List<Factor> factors, int replicates, int centrePoints, int blocks,
                             long seed) {
        if (factors.size() != design.factors()) {
            throw new IllegalArgumentException(design.factors() + " design columns for " + factors.size() + " factors");
        }
        int reps = Math.max(1, replicates);
        int nBlocks = Math.max(1, blocks);
        int k = design.factors();
        int nPts = design.size();
        Blocking blocking = null;
        int[] pointBlock = new int[nPts];
        boolean byReplicate = false;
        if (nBlocks > 1) {
            if (design.regular() != null && design.kind() != org.fabspread.study.PlanSettings.Kind.CENTRAL_COMPOSITE
                    && Integer.bitCount(nBlocks) == 1 && nBlocks <= design.size() / 2) {
                blocking = Blocking.choose(design.regular(), nBlocks);
                for (int p = 0; p < nPts; p++) {
                    pointBlock[p] = blocking.blockOf(p);
                }
            } else if (design.kind() == org.fabspread.study.PlanSettings.Kind.CENTRAL_COMPOSITE && nBlocks == 2) {
                for (int p = 0; p < nPts; p++) {
                    pointBlock[p] = design.types().get(p) == Run.PointType.AXIAL ? 1 : 0;
                }
            } else if (reps % nBlocks == 0) {
                byReplicate = true;
            } else {
                throw new IllegalArgumentException("cannot form " + nBlocks + " blocks for a " + design.name()
                        + " with " + reps + " replicate(s); use 2^q blocks for a two-level design, 2 for a central "
                        + "composite design, or a number of replicates divisible by the blocks");
            }
        }
        record Proto(int std, int block, int rep, Run.PointType type, double[] x) {
        }
        List<Proto> protos = new ArrayList<>();
        for (int rep = 0; rep < reps; rep++) {
            for (int p = 0; p < nPts; p++) {
                int b = byReplicate ? rep / (reps / nBlocks) : pointBlock[p];
                protos.add(new Proto(p + 1, b, rep + 1, design.types().get(p), design.points()[p]));
            }
        }
        for (int c = 0; c < centrePoints; c++) {
            protos.add(new Proto(nPts + c + 1, c % nBlocks, 1, Run.PointType.CENTRE, new double[k]));
        }
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        List<Run> runs = new ArrayList<>();
        for (int b = 0; b < nBlocks; b++) {
            List<Proto> in = new ArrayList<>();
            for (Proto pr : protos) {
                if (pr.block() == b) {
                    in.add(pr);
                }
            }
            int[] order = new int[in.size()];
            for (int i = 0; i < order.length; i++) {
                order[i] = i;
            }
            PermutationSampler.shuffle(rng, order);
            for (int i : order) {
                Proto pr = in.get(i);
                runs.add(new Run(runs.size() + 1, pr.std(), b + 1, pr.rep(), pr.type(), pr.x()));
            }
        }
        return new Plan(design, factors, reps, centrePoints, nBlocks, blocking, seed, runs);
    }

    /** The runs sorted by standard order then replicate (for analysis and listing). */
    public List<Run> inStandardOrder() {
        List<Run> out = new ArrayList<>(runs);
        out.sort(Comparator.comparingInt(Run::standardOrder).thenComparingInt(Run::replicate));
        return out;
    }

    @Override
    public String toString() {
        return design.name() + ", " + runs.size() + " runs, factors " + factorIds() + ", seed " + seed
                + (blocking != null ? ", block generators " + Arrays.toString(blocking.generators()) : "");
    }
}

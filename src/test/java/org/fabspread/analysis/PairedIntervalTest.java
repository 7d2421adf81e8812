package org.fabspread.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.apache.commons.math3.distribution.NormalDistribution;
import org.fabspread.sampling.InputSpace;
import org.fabspread.sampling.Interval;
import org.fabspread.sampling.Intervals;
import org.fabspread.sampling.SampleTable;
import org.fabspread.study.AnalysisSettings.WhatIf.Kind;
import org.fabspread.study.DistributionSpec;
import org.fabspread.study.SourceLocation;
import org.fabspread.study.Target;
import org.junit.jupiter.api.Test;

class PairedIntervalTest {

    @Test
    void pairedIntervalsOfAWhatIfCoverTheTrueChangeNearTheNominalRate() {
        // y = 3 x1 + x2 + x3, x_i normal with sd 1, target y >= 29.5 around mean 31; halving σ of x1 changes
        // the yield from Φ(1.5/√11) to Φ(1.5/√4.25) (source: linear-Gaussian yield, statistics-and-doe.md)
        DistributionSpec[] specs = {new DistributionSpec.Normal(10, 1), new DistributionSpec.Normal(2, 1),
            new DistributionSpec.Normal(-1, 1)};
        InputSpace space = TestSpaces.Independent.of(specs);
        List<Target> targets = List.of(new Target("y", true, 29.5, "mA/cm^2", SourceLocation.unknown("targets[0]")));
        NormalDistribution z = new NormalDistribution(0, 1);
        double truth = z.cumulativeProbability(1.5 / Math.sqrt(4.25)) - z.cumulativeProbability(1.5 / Math.sqrt(11));
        WhatIf.Change c = WhatIf.change("x1", specs[0], Kind.SCALE_SIGMA, 0.5, null);
        int reps = 200;
        int covered = 0;
        int pairedNarrower = 0;
        for (int rep = 0; rep < reps; rep++) {
            SampleTable t = TestSpaces.monteCarlo(new TestModels.Linear(new double[] {3, 1, 1}), space, 1000, 500 + rep);
            WhatIfResult r = WhatIf.evaluate(t, space, targets, List.of(c), WhatIf.Options.defaults().withConfidence(0.9));
            WhatIfResult.WeightedYield y = r.allTargets();
            covered += y.change().contains(truth) ? 1 : 0;
            long x0 = Math.round(y.before() * 1000);
            // an unpaired interval on the same two numbers would be Newcombe's (Stat. Med. 17, 873 (1998))
            Interval unpaired = Intervals.newcombeDifference(Math.round(y.after() * 1000), 1000, x0, 1000, 0.9);
            pairedNarrower += y.change().width() < unpaired.width() ? 1 : 0;
        }
        double rate = covered / (double) reps;
        // common practice: nominal 0.90; 200 independent replications give sd 0.021, allow about 3 sd
        assertTrue(rate > 0.83 && rate < 0.97, "coverage " + rate);
        // the pairing removes the shared sampling noise of the common samples
        assertTrue(pairedNarrower > reps * 0.9, "paired narrower in " + pairedNarrower + " of " + reps);
    }

    @Test
    void newcombeHybridScoreIntervalCheckValues() {
        // source: Newcombe, Stat. Med. 17, 873 (1998), table II, example (a): 56/70 − 48/80, method 10 gives
        // 0.0524 to 0.3339 at 95 % (from memory); cross-checked by the formula from the two Wilson intervals
        Interval d = Intervals.newcombeDifference(56, 70, 48, 80, 0.95);
        assertEquals(0.0524, d.low(), 5e-4);
        assertEquals(0.3339, d.high(), 5e-4);
        Interval a = Intervals.wilson(56, 70, 0.95);
        Interval b = Intervals.wilson(48, 80, 0.95);
        double diff = 56 / 70.0 - 48 / 80.0;
        assertEquals(diff - Math.sqrt(Math.pow(0.8 - a.low(), 2) + Math.pow(b.high() - 0.6, 2)), d.low(), 1e-15);
    }
}

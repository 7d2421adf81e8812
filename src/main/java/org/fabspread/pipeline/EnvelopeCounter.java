package org.fabspread.pipeline;

import java.util.List;

import org.fabspread.device.DeviceModel;
import org.fabspread.device.EnvelopeCounts;
import org.fabspread.device.EnvelopeJudge;
import org.fabspread.sampling.RowSink;

/**
 * Counts a run's samples outside the validity envelope ({@link org.fabspread.device.ValidityEnvelope}),
 * fed by {@link org.fabspread.sampling.RunJob#observe} in sample order, so the counts are the same on any
 * thread count and engine and on a resumed or reloaded run. Every sample is judged from its inputs, failed
 * ones included (the judge leaves undefined geometry inside). Allocates nothing per row.
 */
final class EnvelopeCounter implements RowSink {
    private final EnvelopeJudge judge;
    private final int[] fromSpace;
    private final double[] x;
    private final EnvelopeCounts.Tally tally = new EnvelopeCounts.Tally();

    /**
     * @param model     the device model
     * @param spaceIds  the input space's ids, in the order of the rows' inputs
     */
    EnvelopeCounter(DeviceModel model, List<String> spaceIds) {
        judge = model.envelopeJudge();
        List<String> ids = model.inputIds();
        fromSpace = new int[ids.size()];
        for (int i = 0; i < fromSpace.length; i++) {
            fromSpace[i] = spaceIds.indexOf(ids.get(i));
            if (fromSpace[i] < 0) {
                throw new IllegalArgumentException("model input " + ids.get(i) + " is not in the input space");
            }
        }
        x = new double[fromSpace.length];
    }

    @Override
    public void row(long sample, double[] in, int offX, double[] y, int offY, String status) {
        for (int i = 0; i < x.length; i++) {
            x[i] = in[offX + fromSpace[i]];
        }
        judge.tally(x, 0, tally);
    }

    /** The counts so far. */
    EnvelopeCounts counts() {
        return tally.counts();
    }
}

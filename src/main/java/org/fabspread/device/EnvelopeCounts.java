package org.fabspread.device;

/**
 * How many of a run's samples fell outside the validity envelope, by reason (a sample may count under
 * several reasons; {@code outside} counts each sample once). Immutable; {@link Tally} accumulates it in
 * sample order and integer sums make it independent of the thread count and the engine.
 *
 * @param samples          samples judged
 * @param outside          samples outside for at least one reason
 * @param sizeParameter    samples beyond the small-particle approximation ({@link EnvelopeReason#SIZE_PARAMETER})
 * @param volumeFraction   samples beyond the effective-medium limit ({@link EnvelopeReason#VOLUME_FRACTION})
 * @param largerThanFilm   samples whose particles are larger than their film ({@link EnvelopeReason#LARGER_THAN_FILM})
 * @param beyondMonolayer  samples beyond a monolayer ({@link EnvelopeReason#BEYOND_MONOLAYER})
 */
public record EnvelopeCounts(long samples, long outside, long sizeParameter, long volumeFraction,
                             long largerThanFilm, long beyondMonolayer) {

    /** The count for reason {@code r}. */
    public long count(EnvelopeReason r) {
        return switch (r) {
            case SIZE_PARAMETER -> sizeParameter;
            case VOLUME_FRACTION -> volumeFraction;
            case LARGER_THAN_FILM -> largerThanFilm;
            case BEYOND_MONOLAYER -> beyondMonolayer;
        };
    }

    /** The sum of two partial counts (chunks combined in chunk order). */
    public EnvelopeCounts plus(EnvelopeCounts o) {
        return new EnvelopeCounts(samples + o.samples, outside + o.outside, sizeParameter + o.sizeParameter,
                volumeFraction + o.volumeFraction, largerThanFilm + o.largerThanFilm,
                beyondMonolayer + o.beyondMonolayer);
    }

    /** A mutable accumulator, one per consumer; {@link #add} allocates nothing. */
    public static final class Tally {
        private long samples;
        private long outside;
        private long size;
        private long fill;
        private long film;
        private long mono;

        /** Counts one judged sample. */
        public void add(boolean sizeParameter, boolean volumeFraction, boolean largerThanFilm,
                        boolean beyondMonolayer) {
            samples++;
            if (sizeParameter || volumeFraction || largerThanFilm || beyondMonolayer) {
                outside++;
            }
            size += sizeParameter ? 1 : 0;
            fill += volumeFraction ? 1 : 0;
            film += largerThanFilm ? 1 : 0;
            mono += beyondMonolayer ? 1 : 0;
        }

        /** The counts so far. */
        public EnvelopeCounts counts() {
            return new EnvelopeCounts(samples, outside, size, fill, film, mono);
        }
    }
}

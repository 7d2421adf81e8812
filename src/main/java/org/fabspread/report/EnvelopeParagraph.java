package org.fabspread.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.fabspread.device.EnvelopeCounts;
import org.fabspread.device.EnvelopeReason;

/**
 * The report's sentence on the validity envelope ({@link org.fabspread.device.ValidityEnvelope}): what share
 * of the samples fell outside it and for which reason. Samples outside are computed and kept in every
 * statistic; the sentence tells the reader how far to trust them.
 */
final class EnvelopeParagraph {

    private EnvelopeParagraph() {
    }

    /** The paragraph for a run's counts. */
    static String text(EnvelopeCounts c) {
        if (c.outside() == 0) {
            return String.format(Locale.ROOT, "Validity envelope of the particle optics: all %d samples lie inside"
                    + " it (size parameter, volume fraction, particle height against its film, monolayer coverage).",
                    c.samples());
        }
        List<String> parts = new ArrayList<>();
        for (EnvelopeReason r : EnvelopeReason.values()) {
            long n = c.count(r);
            if (n > 0) {
                parts.add(String.format(Locale.ROOT, "%s: %d (%s)", r.sentence(), n, share(n, c.samples())));
            }
        }
        return String.format(Locale.ROOT, "Validity envelope of the particle optics: %d of %d samples (%s) fell"
                + " outside it and were still computed; by reason (a sample may have several): %s.", c.outside(),
                c.samples(), share(c.outside(), c.samples()), String.join("; ", parts));
    }

    private static String share(long n, long of) {
        return String.format(Locale.ROOT, "%.3g %%", 100.0 * n / of);
    }
}

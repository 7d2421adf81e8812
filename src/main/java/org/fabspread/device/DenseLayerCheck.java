package org.fabspread.device;

import java.util.Locale;
import java.util.Optional;

import org.fabspread.particles.EffectiveMedium;
import org.fabspread.study.ParticleLayer;

/**
 * The validity of Maxwell Garnett mixing over a run's samples: counts the good samples whose particle
 * layer's volume fraction exceeds {@link EffectiveMedium#DENSE_LIMIT}, where the dilute-inclusion
 * assumption of the Maxwell Garnett formula no longer holds (source: J. C. Maxwell Garnett, Phil. Trans. R.
 * Soc. Lond. A 203, 385 (1904); the limit of 0.3 is common practice, see {@link EffectiveMedium}). Samples the model
 * rejected are skipped: their inputs may lie where the particle geometry is undefined.
 */
public final class DenseLayerCheck {

    private DenseLayerCheck() {
    }

    /**
     * The note for a run's samples, or empty when the layer is never dense, the study has no particle
     * layer, the optics come from an enhancement table, or the mixing rule is not Maxwell Garnett.
     *
     * @param model  the device model the samples ran through
     * @param inputs input columns in the model's input order ({@code inputs[i][j]}: input i of sample j)
     * @param ok     which samples the model evaluated without failure
     */
    public static Optional<String> note(DeviceModel model, double[][] inputs, boolean[] ok) {
        if (model.study().particleLayer().isEmpty() || model.enhancementTable().isPresent()
                || model.study().particles().mixingRule() != ParticleLayer.MixingRule.MAXWELL_GARNETT) {
            return Optional.empty();
        }
        int k = inputs.length;
        double[] x = new double[k];
        long dense = 0;
        for (int j = 0; j < ok.length; j++) {
            if (!ok[j]) {
                continue;
            }
            for (int i = 0; i < k; i++) {
                x[i] = inputs[i][j];
            }
            dense += EffectiveMedium.isDense(model.particleVolumeFraction(x)) ? 1 : 0;
        }
        if (dense == 0) {
            return Optional.empty();
        }
        return Optional.of(String.format(Locale.ROOT, "%d of %d samples have a particle volume fraction above %.1f,"
                + " where Maxwell Garnett is unreliable; consider mixing: bruggeman.", dense, ok.length,
                EffectiveMedium.DENSE_LIMIT));
    }
}

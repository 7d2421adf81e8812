package org.fabspread.plan;

import java.util.List;

/**
 * What {@code measured.json} holds: the analysis of a filled run sheet, the model's predicted effects
 * beside the measured ones (inside each estimate), and the calibration of model inputs. Jackson-serialisable.
 *
 * @param calibration null when nothing was calibrated
 * @param notes       why something was skipped
 */
public record MeasuredReport(String study, String runSheet, String response, String unit, List<Factor> factors,
                             EffectAnalysis.Result analysis, Calibration.Result calibration, List<String> notes) {
}

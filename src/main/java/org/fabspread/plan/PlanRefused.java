package org.fabspread.plan;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.fabspread.model.ModelException;

/**
 * The device model refuses a run of the proposed plan (a corner where the particles no longer fit
 * their layer, say), so no plan can be predicted. The message names the run's settings and the
 * model's reason; {@link #remedy()} says what to change in the study.
 */
public final class PlanRefused extends ModelException {

    private static final long serialVersionUID = 1L;

    private final String remedy;

    private PlanRefused(ModelException cause, String message, String remedy) {
        super(cause.reason(), message);
        initCause(cause);
        this.remedy = remedy;
    }

    /** What to change: the factors to narrow, with the study keys. */
    public String remedy() {
        return remedy;
    }

    /** The refusal of one design point, coded levels {@code coded}. */
    static PlanRefused of(ModelException cause, List<Factor> factors, double[] coded) {
        List<String> at = new ArrayList<>();
        List<String> moved = new ArrayList<>();
        for (int i = 0; i < factors.size(); i++) {
            Factor f = factors.get(i);
            at.add(String.format(Locale.ROOT, "%s %s %s", f.id(), RunSheet.format(f.toSheet(f.setting(coded[i]))),
                    f.sheetUnit()));
            if (Math.abs(coded[i]) > 1e-9) {
                moved.add(f.id());
            }
        }
        String message = "the device model refuses the plan's run at " + String.join(", ", at) + " ("
                + cause.getMessage() + ")";
        String remedy = "give plan.limits for " + (moved.isEmpty() ? "the factors" : String.join(" and ", moved))
                + " that keep every run inside what the model accepts, or lower plan.levels, or leave one of them "
                + "out of plan.factors";
        return new PlanRefused(cause, message, remedy);
    }
}

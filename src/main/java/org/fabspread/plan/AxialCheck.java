package org.fabspread.plan;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.fabspread.sampling.Distribution;
import org.fabspread.sampling.InputSpace;
import org.fabspread.study.PlanSettings;

/**
 * Whether the axial points of a rotatable central composite design stay inside each input's range.
 * The rotatable distance α = (n_F)^{1/4} (Box &amp; Hunter, Ann. Math. Stat. 28, 195 (1957)) puts the
 * axial runs beyond the low/high levels; when a level already sits at the end of the input's support
 * (a uniform 8–12 nm layer), those runs cannot be made. The published alternative is the face-centred
 * design (α = 1; Montgomery, Design and Analysis of Experiments, response surface chapter), which
 * keeps every run at a low, centre or high level and gives up rotatability.
 */
public final class AxialCheck {

    private AxialCheck() {
    }

    /**
     * An empty string when the design is not a rotatable central composite design or its axial points
     * fit; otherwise the note that says which inputs they leave and what the plan does instead.
     */
    public static String outsideSupport(CodedDesign design, List<Factor> factors, InputSpace space) {
        if (design.kind() != PlanSettings.Kind.CENTRAL_COMPOSITE || !(design.alpha() > 1)) {
            return "";
        }
        double a = design.alpha();
        List<String> out = new ArrayList<>();
        for (Factor f : factors) {
            Distribution d = space.marginals().get(space.ids().indexOf(f.id()));
            double lo = f.setting(-a);
            double hi = f.setting(a);
            if (lo < d.supportLower() || hi > d.supportUpper()) {
                out.add(String.format(Locale.ROOT, "%s at %s and %s %s (its range is %s to %s %s)", f.id(),
                        RunSheet.format(f.toSheet(lo)), RunSheet.format(f.toSheet(hi)), f.sheetUnit(),
                        RunSheet.format(f.toSheet(d.supportLower())), RunSheet.format(f.toSheet(d.supportUpper())),
                        f.sheetUnit()));
            }
        }
        if (out.isEmpty()) {
            return "";
        }
        return String.format(Locale.ROOT, "The rotatable axial distance alpha = %.4g would run %s, outside the "
                + "range the input can take, so the plan uses face-centred axial points (alpha = 1) instead: every "
                + "run stays at a low, centre or high level, and the design is no longer rotatable (an inscribed "
                + "design, the cube shrunk to +/-1/alpha, would keep rotatability at the price of smaller effects).",
                a, String.join("; ", out));
    }
}

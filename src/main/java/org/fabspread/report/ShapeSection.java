package org.fabspread.report;

import static org.fabspread.report.ResultLookup.*;

import java.util.ArrayList;
import java.util.List;

import org.fabspread.analysis.ScreeningResult;
import org.fabspread.analysis.SobolResult;
import org.fabspread.analysis.ToleranceRanking;
import org.fabspread.device.ShapeTableSummary;
import org.fabspread.pipeline.StudyResults;

/**
 * The report's "Particle shape" section, for a named shape solved by the discrete-dipole method: the nominal
 * particle's extinction per in-plane polarisation with its two resonances, what the spread of each tabulated
 * shape parameter costs (its share of the followed output's variance and the yield gained by halving its σ),
 * and how well the table interpolates (the leave-one-out estimate).
 */
final class ShapeSection {

    /** The section id. */
    static final String ID = "shape";

    /** Above this interpolation error the section warns that the table is too coarse (common practice: 10 %). */
    static final double COARSE = 0.10;

    private final ChartFactory charts;

    ShapeSection(ChartFactory charts) {
        this.charts = charts;
    }

    /** The section, or null when the study's particles are not a tabulated shape. */
    Section section(StudyResults r) {
        if (r.crossSections() == null || r.crossSections().shape() == null) {
            return null;
        }
        ShapeTableSummary t = r.crossSections().shape();
        List<Block> b = new ArrayList<>();
        b.add(new Paragraph(resonances(t)));
        b.add(new Figure(charts.polarisedExtinction("shape-polarisations", "The nominal " + t.kind() + " per polarisation",
                t.wavelengthNm(), t.extinctionX(), t.extinctionY(), "nm²"),
                "Extinction cross-section of one nominal " + t.kind() + " from the discrete-dipole table, with the"
                        + " incident field along the film's x axis and along y, and their mean (unpolarised light)."));
        String out = focusOutput(r);
        List<List<String>> rows = new ArrayList<>();
        for (int d = 0; d < t.parameters().size(); d++) {
            String id = t.parameters().get(d);
            rows.add(List.of(id, Numbers.num(t.low()[d]) + "–" + Numbers.num(t.high()[d]) + " nm",
                    Integer.toString(t.nodes()[d]), share(r, out, id), tighten(r.ranking(), id),
                    error(t.parameterError()[d])));
        }
        b.add(Table.of("What the shape spread costs (" + ReportText.label(out) + ") and how well the table holds",
                List.of("shape input", "tabulated range", "nodes", "share of the variance", "halving its σ",
                        "interpolation error"), rows));
        b.add(new Paragraph("The table was solved at " + t.tabulatedWavelengths() + " wavelengths and interpolated"
                + " onto the study's grid (wavelength interpolation error " + error(t.wavelengthError()) + "). The"
                + " interpolation error is a leave-one-out estimate: each interior node is dropped and predicted from"
                + " the others, relative to the polarisation's largest extinction; it errs on the high side. Samples"
                + " outside a tabulated range are clamped to its end."));
        if (t.worstError() > COARSE) {
            b.add(new Paragraph("Caution: the table's interpolation error reaches " + Numbers.pct(t.worstError())
                    + ", above " + Numbers.pct(COARSE) + ": between its nodes the spectra above are uncertain by about"
                    + " that much. Give particles.shape.table_nodes more nodes or a smaller table_wavelength_step (each"
                    + " costs solves), or narrow the shape spread, before relying on what the shape spread costs."));
        }
        return new Section(ID, "Particle shape", b);
    }

    private static String resonances(ShapeTableSummary t) {
        double x = t.resonanceX();
        double y = t.resonanceY();
        String s = "The nominal " + t.kind() + " resonates at " + Numbers.num(x) + " nm with the field along x"
                + edge(t.resonanceAtEdgeX()) + " and at " + Numbers.num(y) + " nm with the field along y"
                + edge(t.resonanceAtEdgeY()) + "; ";
        s += x == y ? "the two polarisations resonate together." : "the two resonances lie "
                + Numbers.num(Math.abs(x - y)) + " nm apart, and unpolarised light sees their mean, a broader band.";
        return s;
    }

    private static String edge(boolean atEdge) {
        return atEdge ? " (at the end of the study's wavelength range: the peak may lie beyond it)" : "";
    }

    private static String share(StudyResults r, String out, String id) {
        if (r.sobol() != null && hasOutput(r.sobol(), out)) {
            SobolResult.IndexEstimate e = r.sobol().output(out).input(id);
            if (e != null) {
                return "total Sobol " + Numbers.num3(e.total());
            }
        }
        if (r.screening() != null && hasOutput(r.screening(), out)) {
            ScreeningResult.InputScreening e = r.screening().output(out).input(id);
            if (e != null) {
                return "first order " + Numbers.num3(e.firstOrder());
            }
        }
        return "–";
    }

    private static String tighten(ToleranceRanking ranking, String id) {
        if (ranking == null) {
            return "–";
        }
        for (ToleranceRanking.Entry e : ranking.entries()) {
            if (e.input().equals(id)) {
                if (e.rerunNeeded()) {
                    return "needs a re-run";
                }
                String gain = Numbers.points(e.yieldGain()) + " of yield";
                return e.gain() == null ? gain : gain + " (interval " + signed(e.gain().low()) + " to " + signed(e.gain().high())
                        + " points)";
            }
        }
        return "–";
    }

    private static String signed(double fraction) {
        return (fraction < 0 ? "−" : "+") + Numbers.pctNumber(Math.abs(fraction));
    }

    private static String error(double e) {
        return Double.isFinite(e) ? Numbers.pct(e) : "not estimated (too few nodes)";
    }
}

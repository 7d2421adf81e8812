package org.fabspread.device;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.fabspread.dda.DdaSettings;
import org.fabspread.dda.InterpolationError;
import org.fabspread.dda.Nodes;
import org.fabspread.dda.ParametricFamily;
import org.fabspread.dda.Quantity;
import org.fabspread.dda.ShapeTable;
import org.fabspread.dda.TableCache;
import org.fabspread.dda.TableSpec;
import org.fabspread.optics.LayerOptics;
import org.fabspread.shapes.Shape;
import org.fabspread.study.DistributionSpec;
import org.fabspread.study.Parameter;
import org.fabspread.study.ParticleShape;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;

/**
 * Builds a named shape's discrete-dipole table once per study: Chebyshev nodes (first kind) of each
 * uncertain shape parameter over its central 99.9 % range, a wavelength subgrid of the study's grid (about
 * every {@link ParticleShape#wavelengthStep} nm, both ends kept), the bulk metal's permittivity and the
 * host's nominal real index there. The table comes from {@link TableCache} in the study folder's
 * {@code .fabspread-cache} when an equal one was made before, else from the solver (progress on a terminal,
 * quiet otherwise), and is resampled to the study's grid.
 */
final class ShapeTables {
    /** Cache folder beside the study file. */
    static final String CACHE_FOLDER = ".fabspread-cache";
    /** Standard-normal quantile of 0.9995: the central 99.9 % of a normal spread. */
    private static final double Z = 3.2905267314918945;

    private ShapeTables() {
    }

    /**
     * A shape's table on the study grid.
     *
     * @param table     single-particle quantities on the study grid
     * @param varying   positions (in the shape's parameter order) of the tabulated parameters
     * @param low       lower end of each tabulated parameter's range (samples are clamped into it), nm
     * @param high      upper end, nm
     * @param area      projected area on the film plane at each node, nm²
     * @param volume    particle volume at each node, nm³
     * @param error     the leave-one-out interpolation error estimate
     * @param cached    whether the table was read from the cache
     * @param kind      the shape kind
     * @param tabulatedWavelengths the number of wavelengths the solver ran at
     * @param cacheFolder the folder of the table cache
     */
    record Built(ShapeTable table, int[] varying, double[] low, double[] high, double[] area, double[] volume,
                 InterpolationError error, boolean cached, String kind, int tabulatedWavelengths, Path cacheFolder) {

        /** One line for the run's log: where the table came from (not in summary.json, which must not depend on it). */
        String origin() {
            int shapes = table.nodeCount();
            return "particles.shape: the " + kind + "'s discrete-dipole table (" + shapes + (shapes == 1 ? " shape" : " shapes")
                    + " x " + tabulatedWavelengths + " wavelengths x 2 polarisations) was "
                    + (cached ? "read from the cache in " : "solved and saved to the cache in ") + cacheFolder
                    + (Double.isFinite(error.worst()) ? String.format(java.util.Locale.ROOT,
                    "; leave-one-out interpolation error up to %.1f %%", 100 * error.worst()) : "");
        }

        /**
         * The table's account of the nominal particle: per-polarisation extinction at the nominal shape values
         * (clamped into the tabulated range, as the samples are) and the table's ranges and error estimate.
         *
         * @param names        the shape's parameter names, in the shape's order
         * @param shapeNominal the nominal value of each shape parameter, same order, nm
         */
        ShapeTableSummary summary(List<String> names, double[] shapeNominal) {
            double[] at = new double[varying.length];
            List<String> ids = new ArrayList<>();
            int[] nodes = new int[varying.length];
            for (int d = 0; d < varying.length; d++) {
                at[d] = Math.min(high[d], Math.max(low[d], shapeNominal[varying[d]]));
                ids.add("particles.shape." + names.get(varying[d]));
                nodes[d] = table.nodes(d).length;
            }
            double[] w = new double[table.scratchSize()];
            table.weights(at, w);
            int nw = table.wavelengthCount();
            double[] x = new double[nw];
            double[] y = new double[nw];
            for (int i = 0; i < nw; i++) {
                x[i] = table.value(Quantity.EXTINCTION, ShapeTable.POL_X, i, w);
                y[i] = table.value(Quantity.EXTINCTION, ShapeTable.POL_Y, i, w);
            }
            return new ShapeTableSummary(kind, ids, low, high, nodes, tabulatedWavelengths, error.parameter(),
                    error.wavelength(), table.wavelengths(), x, y);
        }
    }

    static Built build(Study study, ParameterVector params, ParticleSlots slots, StackSlots stack, int host,
                       LayerOptics optics, double[] lambda, double[] metalEpsRe, double[] metalEpsIm) {
        ParticleShape ps = study.particleLayer().orElseThrow().shape();
        List<String> names = new ArrayList<>(ps.parameters().keySet());
        Map<String, Double> fixed = new LinkedHashMap<>();
        List<String> varying = new ArrayList<>();
        List<double[]> nodes = new ArrayList<>();
        List<Integer> positions = new ArrayList<>();
        List<double[]> ranges = new ArrayList<>();
        for (int j = 0; j < names.size(); j++) {
            Parameter p = ps.parameters().get(names.get(j));
            int slot = slots.shape()[j];
            if (!params.uncertain(slot)) {
                fixed.put(names.get(j), p.nominal());
                continue;
            }
            double[] r = range(p.distribution());
            r[0] = Math.max(r[0], names.get(j).equals("bite_offset") ? 0 : 1e-3 * Math.max(r[1], 1));
            varying.add(names.get(j));
            positions.add(j);
            ranges.add(r);
            nodes.add(Nodes.chebyshev(r[0], r[1], r[1] > r[0] ? ps.nodes() : 1));
        }
        int[] sub = subgrid(lambda, ps.wavelengthStep());
        double[] wl = new double[sub.length];
        double[] er = new double[sub.length];
        double[] ei = new double[sub.length];
        double[] nh = new double[sub.length];
        double shift = ParameterVector.value(params.nominal(), stack.nShift()[host], 0);
        double[] hostN = optics.n(host);
        for (int s = 0; s < sub.length; s++) {
            wl[s] = lambda[sub[s]];
            er[s] = metalEpsRe[sub[s]];
            ei[s] = metalEpsIm[sub[s]];
            nh[s] = hostN[sub[s]] + shift;
        }
        String where = StudyCompiler.prefix(study) + "particles.shape";
        ParametricFamily family;
        TableSpec spec;
        try {
            family = new ParametricFamily(ps.kind(), fixed, varying);
            spec = new TableSpec(family, nodes.toArray(new double[0][]), wl, er, ei, nh,
                    DdaSettings.defaults().withPitch(ps.latticePitch()));
        } catch (IllegalArgumentException e) {
            throw new StudyException(where + ": " + e.getMessage(), e);
        }
        int count = spec.nodeCount();
        double[] area = new double[count];
        double[] volume = new double[count];
        for (int node = 0; node < count; node++) {
            Shape shape;
            try {
                shape = family.shape(spec.nodeValues(node));
            } catch (IllegalArgumentException e) {
                throw new StudyException(where + ": the spread of the shape parameters reaches a shape that does not exist ("
                        + e.getMessage() + "); narrow the spread", e);
            }
            volume[node] = shape.volume();
            area[node] = projectedArea(shape);
        }
        Path dir = (study.file() == null ? Path.of(System.getProperty("java.io.tmpdir"))
                : study.file().toAbsolutePath().getParent()).resolve(CACHE_FOLDER);
        boolean cached = TableCache.load(dir, spec).isPresent();
        ShapeTable t;
        try {
            boolean terminal = System.console() != null && System.getenv("CI") == null;
            ShapeTabulatorProgress progress = terminal ? new ShapeTabulatorProgress(ps.kind()) : null;
            t = TableCache.loadOrTabulate(dir, spec, Runtime.getRuntime().availableProcessors(), progress);
            if (progress != null) {
                progress.done();
            }
        } catch (IOException e) {
            throw new StudyException(where + ": cannot write the shape table cache in " + dir + ": " + e.getMessage(), e);
        } catch (IllegalStateException | IllegalArgumentException e) {
            throw new StudyException(where + ": the discrete-dipole solve failed: " + e.getMessage(), e);
        }
        InterpolationError err = InterpolationError.estimate(t);
        double[] low = new double[ranges.size()];
        double[] high = new double[ranges.size()];
        for (int d = 0; d < low.length; d++) {
            low[d] = ranges.get(d)[0];
            high[d] = ranges.get(d)[1];
        }
        return new Built(t.resample(lambda), positions.stream().mapToInt(Integer::intValue).toArray(), low, high,
                area, volume, err, cached, ps.kind(), wl.length, dir);
    }

    /**
     * The shape parameter that is the particle layer's height for a shape lying flat on the film: the
     * diameter of a sphere or a rod lying down, the width of a spheroid, else the thickness.
     */
    static String heightParameter(String kind) {
        return switch (kind) {
            case "sphere", "rod" -> "diameter";
            case "spheroid" -> "width";
            default -> "thickness";
        };
    }

    /** Central 99.9 % range of a spread (the support for bounded ones). */
    static double[] range(DistributionSpec d) {
        if (d instanceof DistributionSpec.Normal n) {
            return new double[] {n.mean() - Z * n.sigma(), n.mean() + Z * n.sigma()};
        }
        if (d instanceof DistributionSpec.TruncatedNormal n) {
            return new double[] {Math.max(n.lower(), n.mean() - Z * n.sigma()), Math.min(n.upper(), n.mean() + Z * n.sigma())};
        }
        if (d instanceof DistributionSpec.LogNormal n) {
            double s = Math.sqrt(Math.log1p(n.cv() * n.cv()));
            return new double[] {n.median() * Math.exp(-Z * s), n.median() * Math.exp(Z * s)};
        }
        if (d instanceof DistributionSpec.Uniform u) {
            return new double[] {u.lower(), u.upper()};
        }
        if (d instanceof DistributionSpec.Triangular t) {
            return new double[] {t.lower(), t.upper()};
        }
        if (d instanceof DistributionSpec.Empirical e) {
            double lo = Double.POSITIVE_INFINITY;
            double hi = Double.NEGATIVE_INFINITY;
            for (double v : e.values()) {
                lo = Math.min(lo, v);
                hi = Math.max(hi, v);
            }
            return new double[] {lo, hi};
        }
        return new double[] {d.nominal(), d.nominal()};
    }

    /** Grid indices about every {@code step} nm, the first and the last always included. */
    static int[] subgrid(double[] lambda, double step) {
        List<Integer> idx = new ArrayList<>();
        idx.add(0);
        double last = lambda[0];
        for (int i = 1; i < lambda.length - 1; i++) {
            if (lambda[i] - last >= step - 1e-9) {
                idx.add(i);
                last = lambda[i];
            }
        }
        if (lambda.length > 1) {
            idx.add(lambda.length - 1);
        }
        return idx.stream().mapToInt(Integer::intValue).toArray();
    }

    /**
     * Projected area on the film plane: flat kinds (disk, triangular prism, crescent) volume / thickness;
     * a sphere π d²/4; an in-plane spheroid π L W / 4; an in-plane rod (cylinder with hemispherical caps,
     * overall length L) (L − d) d + π d²/4.
     */
    static double projectedArea(Shape s) {
        Map<String, Double> p = s.parameters();
        return switch (s.kind()) {
            case "sphere" -> Math.PI * p.get("diameter") * p.get("diameter") / 4;
            case "spheroid" -> Math.PI * p.get("length") * p.get("width") / 4;
            case "rod" -> {
                double d = p.get("diameter");
                yield Math.max(0, p.get("length") - d) * d + Math.PI * d * d / 4;
            }
            default -> s.volume() / p.get("thickness");
        };
    }

    /** Solves done, on one terminal line. */
    private static final class ShapeTabulatorProgress implements org.fabspread.dda.ShapeTabulator.Progress {
        private final String kind;
        private int shown = -1;

        ShapeTabulatorProgress(String kind) {
            this.kind = kind;
        }

        @Override
        public void solved(int done, int total) {
            int pct = (int) (100L * done / total);
            if (pct != shown) {
                shown = pct;
                System.err.print("\rtabulating the " + kind + " (discrete dipoles): " + done + "/" + total + " solves");
                System.err.flush();
            }
        }

        void done() {
            if (shown >= 0) {
                System.err.println();
            }
        }
    }
}

package org.fabspread.device;

import org.fabspread.optics.CoherentStack;
import org.fabspread.optics.IncoherentSubstrate;
import org.fabspread.optics.SolarSpectrum;
import org.fabspread.study.ParticleLayer;

/**
 * One thread's evaluator of a {@link DeviceModel}: owns every scratch array (transfer-matrix solvers,
 * layer constants, Hecht coefficients, the particle ensemble) and allocates nothing per sample or per
 * wavelength.
 */
final class DeviceEvaluator {
    private static final double FOUR_PI = 4 * Math.PI;

    private final DeviceModel m;
    private final int nl;
    private final int nc;
    final double[] v;
    private final CoherentStack stack;
    private final CoherentStack back;
    private final double[] nRe;
    private final double[] nIm;
    private final double[] dC;
    private final double[] dPlanar;
    private final double[] x0;
    /** no layers: the back solve of an absorber with nothing behind it (the exit medium alone). */
    private static final double[] NONE = new double[0];
    private final double[] dL;
    private final double[] shift;
    private final double[] scale;
    private final double[] ellE;
    private final double[] ellH;
    private final double[] avgEta;
    private final double[][] hs;
    /** per computational layer: Hecht coefficient times e^{s x0} of its offset in its absorber. */
    private final double[][] compCoef;
    final ParticleStep particleStep;
    private final double[] diode = new double[OneDiode.RESULT_SIZE];
    /** per wavelength: the table's enhancement at this sample (null without a table). */
    private final double[] enh;
    /** wavelengths of the last run at which the table's absorption was capped. */
    private int capped;

    // per-sample scalars
    private double etaD;
    private double fFwd;
    private double offset;
    private double height;
    private boolean particlesOn;
    private double hostAverageEta;
    private double nearFieldEta;
    // results of the last main solve with the substrate folded in
    private double glassR;
    private double glassT;
    private double glassA;
    /** substrate entry factor of the last main solve. */
    private double lastEntry;

    // per-wavelength results (averaged over polarisation passes)
    private double wR;
    private double wT;
    private double wGlass;
    private final double[] wLayer;
    private final double[] wBucket;
    private double wOpt;
    private double wCol;
    private double wMetal;
    private double wSca;
    private double wHost;
    private double wQuench;
    private double wNf;
    private double wDiff;
    private double wLost;

    DeviceEvaluator(DeviceModel m) {
        this.m = m;
        this.nl = m.layerCount;
        this.nc = m.compCount;
        v = new double[m.nominal.length];
        stack = new CoherentStack(nc);
        back = new CoherentStack(0);
        nRe = new double[nc];
        nIm = new double[nc];
        dC = new double[nc];
        dPlanar = new double[nc];
        x0 = new double[nc];
        dL = new double[nl];
        shift = new double[nl];
        scale = new double[nl];
        ellE = new double[nl];
        ellH = new double[nl];
        avgEta = new double[nl];
        hs = new double[nl][HechtCollection.TERMS];
        compCoef = new double[nc][HechtCollection.TERMS];
        wLayer = new double[nl];
        wBucket = new double[4];
        particleStep = m.hasParticles && !m.usesTable
                ? new ParticleStep(m.particles, m.lambda.length, m.sphereTable, SphereTable.hostShift(m), SphereTable.hostScale(m))
                : null;
        enh = m.usesTable ? new double[m.lambda.length] : null;
    }

    /** Copies the nominal vector and overwrites the uncertain slots. */
    double[] sampleVector(double[] inputs) {
        if (inputs.length != m.inputSlot.length) {
            throw new IllegalArgumentException("expected " + m.inputSlot.length + " inputs, got " + inputs.length);
        }
        double[] out = m.nominal.clone();
        for (int i = 0; i < inputs.length; i++) {
            out[m.inputSlot[i]] = inputs[i];
        }
        return out;
    }

    void evaluate(double[] inputs, double[] outputs) {
        if (inputs.length != m.inputSlot.length) {
            throw new IllegalArgumentException("expected " + m.inputSlot.length + " inputs, got " + inputs.length);
        }
        System.arraycopy(m.nominal, 0, v, 0, v.length);
        for (int i = 0; i < inputs.length; i++) {
            v[m.inputSlot[i]] = inputs[i];
        }
        run(v, outputs, null);
        if (capped > 0) {
            m.capSamples.increment();
            m.capWavelengths.add(capped);
        }
    }

    /** Wavelengths of the last run at which the table's absorber absorption was capped (0 without a table). */
    int cappedWavelengths() {
        return capped;
    }

    /**
     * Runs the model; a failure inside the optics or particle code (an argument it refuses) becomes a
     * {@link org.fabspread.model.ModelException}, and so does a NaN output.
     */
    void run(double[] values, double[] out, SpectraRecorder rec) {
        try {
            runUnchecked(values, out, rec);
        } catch (IllegalArgumentException | ArithmeticException ex) {
            throw new org.fabspread.model.ModelException("out-of-range", ex.getMessage());
        }
        for (double o : out) {
            if (Double.isNaN(o)) {
                throw new org.fabspread.model.ModelException("nan", "the device model produced NaN");
            }
        }
    }

    private double value(int slot, double dflt) {
        return slot < 0 ? dflt : v[slot];
    }

    /**
     * Where the particle layer of height {@link #height} starts inside its host of thickness hostD (nm from
     * the host's front face), by the study's placement; a layer that does not fit is a model exception naming
     * the offset or diameter. Inside the rounding tolerance it is snapped onto the host.
     */
    private double placeInHost(double hostD) {
        ParticleLayer p = m.particles;
        double at = switch (p.placement()) {
            case FRONT -> 0;
            case BACK -> hostD - height;
            case OFFSET -> value(m.pOffset, 0);
        };
        double tol = 1e-9 * Math.max(1, hostD);
        if (!(at >= -tol) || at + height > hostD + tol) {
            int slot = p.placement() == ParticleLayer.Placement.OFFSET && m.pOffset >= 0 ? m.pOffset : m.pDiameter;
            throw new DeviceModel.InputException("particle-layer-outside-host", slot, String.format(java.util.Locale.ROOT,
                    "particle layer (offset %.4g nm, height %.4g nm) does not fit inside host layer %s (%.4g nm)",
                    at, height, m.study.stack().get(m.host).name(), hostD));
        }
        return Math.max(0, Math.min(at, hostD - height));
    }

    private DeviceModel.InputException bad(String reason, int slot, String what) {
        String id = slot >= 0 ? m.paramIds[slot] : "input";
        return new DeviceModel.InputException(reason, slot, id + ": " + what);
    }

    private void requireFinite(int slot) {
        if (slot >= 0 && Double.isNaN(v[slot])) {
            throw bad("nan", slot, "is NaN");
        }
    }

    /** Validates the parameter vector {@link #v} and computes every per-sample quantity. */
    void prepare(double[] values) {
        if (values != v) {
            System.arraycopy(values, 0, v, 0, v.length);
        }
        for (int s = 0; s < v.length; s++) {
            requireFinite(s);
        }
        for (int j = 0; j < nl; j++) {
            double d = v[m.thickSlot[j]];
            if (!(d >= 0) || Double.isInfinite(d)) {
                throw bad("negative-thickness", m.thickSlot[j], "thickness must be >= 0 nm, got " + d);
            }
            if (m.isAbsorber[j] && d == 0) {
                throw bad("out-of-range", m.thickSlot[j], "an absorber needs a thickness > 0 nm");
            }
            dL[j] = d;
            shift[j] = value(m.shiftSlot[j], 0);
            scale[j] = value(m.scaleSlot[j], 1);
            if (!(scale[j] >= 0)) {
                throw bad("out-of-range", m.scaleSlot[j], "k scale must be >= 0, got " + scale[j]);
            }
            if (!(m.minN[j] + shift[j] > 0)) {
                throw bad("out-of-range", m.shiftSlot[j], "n shift " + shift[j] + " makes n <= 0");
            }
        }

        // collection
        etaD = v[m.cDissociation];
        if (!(etaD >= 0 && etaD <= 1)) {
            throw bad("out-of-range", m.cDissociation, "dissociation efficiency must be in [0, 1], got " + etaD);
        }
        double muE = v[m.cElectronMuTau];
        double muH = v[m.cHoleMuTau];
        double vbi = v[m.cBuiltIn];
        if (!(muE >= 0)) {
            throw bad("out-of-range", m.cElectronMuTau, "must be >= 0 cm^2/V, got " + muE);
        }
        if (!(muH >= 0)) {
            throw bad("out-of-range", m.cHoleMuTau, "must be >= 0 cm^2/V, got " + muH);
        }
        if (!(vbi > 0)) {
            throw bad("out-of-range", m.cBuiltIn, "built-in voltage must be > 0 V, got " + vbi);
        }
        double quench = value(m.cQuenching, 0);
        if (!(quench >= 0)) {
            throw bad("out-of-range", m.cQuenching, "quenching distance must be >= 0 nm, got " + quench);
        }
        for (int j = 0; j < nl; j++) {
            if (m.isAbsorber[j]) {
                double d = dL[j];
                ellE[j] = HechtCollection.clampDrift(HechtCollection.driftLengthNm(muE, vbi, d), d);
                ellH[j] = HechtCollection.clampDrift(HechtCollection.driftLengthNm(muH, vbi, d), d);
                avgEta[j] = HechtCollection.uniformAverage(ellE[j], ellH[j], d);
            }
        }

        // particle layer geometry and the host split
        particlesOn = false;
        height = 0;
        offset = 0;
        if (m.usesTable) {
            prepareTable();
        } else if (m.hasParticles) {
            double hostD = dL[m.host];
            particleStep.setSample(v, m, m.isAbsorber[m.host] ? quench : 0);
            height = particleStep.layerHeight();
            offset = placeInHost(hostD);
            fFwd = value(m.pForward, 0.5);
            if (!(fFwd >= 0 && fFwd <= 1)) {
                throw bad("out-of-range", m.pForward, "forward fraction must be in [0, 1], got " + fFwd);
            }
            double centre = offset + 0.5 * height;
            particleStep.setNeighbourDistance(m.neighbourBehind ? hostD - centre : centre);
            int nb = m.neighbour;
            particleStep.completeKey(shift[m.host], scale[m.host], nb >= 0 ? shift[nb] : 0, nb >= 0 ? scale[nb] : 1);
            particlesOn = particleStep.active();
        }

        // computational thicknesses and depth offsets
        for (int c = 0; c < nc; c++) {
            int j = m.compLayer[c];
            switch (m.compKind[c]) {
                case DeviceModel.K_HOST_FRONT -> {
                    dC[c] = particlesOn ? offset : dL[j];
                    x0[c] = 0;
                    dPlanar[c] = dL[j];
                }
                case DeviceModel.K_EFFECTIVE -> {
                    dC[c] = particlesOn ? height : 0;
                    x0[c] = offset;
                    dPlanar[c] = 0;
                }
                case DeviceModel.K_HOST_BACK -> {
                    dC[c] = particlesOn ? Math.max(0, dL[j] - offset - height) : 0;
                    x0[c] = offset + height;
                    dPlanar[c] = 0;
                }
                default -> {
                    dC[c] = dL[j];
                    x0[c] = 0;
                    dPlanar[c] = dL[j];
                }
            }
            if (m.isAbsorber[j]) {
                double[] cc = compCoef[c];
                HechtCollection.exponentials(ellE[j], ellH[j], dL[j], m.electronsAtFront, cc, hs[j]);
                for (int t = 0; t < HechtCollection.TERMS; t++) {
                    cc[t] *= Math.exp(hs[j][t] * x0[c]);
                }
            }
        }
        if (m.hasParticles) {
            int j = m.host;
            hostAverageEta = m.isAbsorber[j]
                    ? HechtCollection.averageOver(ellE[j], ellH[j], dL[j], m.electronsAtFront, offset, offset + height)
                    : 0;
            if (m.neighbour >= 0) {
                int nb = m.neighbour;
                double x = m.neighbourBehind ? 0 : dL[nb];
                nearFieldEta = HechtCollection.eta(ellE[nb], ellH[nb], dL[nb], m.electronsAtFront, x);
            } else {
                nearFieldEta = 0;
            }
        }
    }

    /**
     * With an enhancement table: checks the median particle fits in its host (height 2c = D p^{1/3} q^{2/3},
     * see {@link ParticleLayer}) and fills {@link #enh} at the sample's diameter and coverage. The particle
     * layer stays out of the transfer matrix ({@link #particlesOn} false).
     */
    private void prepareTable() {
        double hostD = dL[m.host];
        double d = v[m.pDiameter];
        double p = value(m.pInPlane, 1);
        double q = value(m.pOutOfPlane, 1);
        if (!(d > 0)) {
            throw bad("out-of-range", m.pDiameter, "diameter must be > 0 nm, got " + d);
        }
        if (!(p >= 1)) {
            throw bad("out-of-range", m.pInPlane, "in-plane aspect ratio must be >= 1, got " + p);
        }
        if (!(q > 0)) {
            throw bad("out-of-range", m.pOutOfPlane, "out-of-plane aspect ratio must be > 0, got " + q);
        }
        height = d * Math.cbrt(p) * Math.pow(q, 2.0 / 3);
        offset = placeInHost(hostD);
        double theta = v[m.pCoverage];
        EnhancementTable t = m.tableOnGrid.table();
        if (!t.covers(EnhancementTable.Axis.DIAMETER, d)) {
            throw bad(EnhancementTable.OUTSIDE_REASON, m.pDiameter, t.outsideMessage(EnhancementTable.Axis.DIAMETER, d));
        }
        if (!t.covers(EnhancementTable.Axis.COVERAGE, theta)) {
            throw bad(EnhancementTable.OUTSIDE_REASON, m.pCoverage, t.outsideMessage(EnhancementTable.Axis.COVERAGE, theta));
        }
        m.tableOnGrid.fill(d, theta, enh);
    }

    /**
     * Applies the table's enhancement g at wavelength i to the planar result just solved: every absorber
     * layer's absorptance, the optical and the collected share are multiplied by g, and the change is taken
     * from (or, for g &lt; 1, returned to) the reflection; capped at A + R so R stays ≥ 0 (counted).
     * Returns the factor applied.
     */
    private double applyEnhancement(int i) {
        double a = wOpt;
        if (!(a > 0)) {
            return 1;
        }
        double s = enh[i];
        double extra = (s - 1) * a;
        if (extra > wR) {
            s = 1 + wR / a;
            extra = wR;
            capped++;
        }
        wR -= extra;
        for (int j = 0; j < nl; j++) {
            if (m.isAbsorber[j]) {
                wLayer[j] *= s;
            }
        }
        wOpt *= s;
        wCol *= s;
        return s;
    }

    /**
     * The particle ensemble at wavelength i with the sample's host and neighbour constants; reuses the
     * previous sample's result when no input of the particle optics changed ({@code useCache}).
     */
    void particlesAt(int i, boolean useCache) {
        int h = m.host;
        double hn = m.optics.n(h, i) + shift[h];
        double hk = m.optics.k(h, i) * scale[h];
        double nbRe = 1;
        double nbIm = 0;
        if (m.neighbour >= 0) {
            int nb = m.neighbour;
            double n = m.optics.n(nb, i) + shift[nb];
            double k = m.optics.k(nb, i) * scale[nb];
            nbRe = n * n - k * k;
            nbIm = 2 * n * k;
        }
        particleStep.atWavelength(i, useCache, m.lambda[i], m.metalEpsRe[i], m.metalEpsIm[i], hn * hn - hk * hk, 2 * hn * hk,
                nbRe, nbIm, m.neighbour >= 0);
    }

    /** Runs the model on the parameter vector; records spectra when {@code rec} is not null. */
    private void runUnchecked(double[] values, double[] out, SpectraRecorder rec) {
        prepare(values);
        final int nw = m.lambda.length;
        double sCol = 0;
        double sOpt = 0;
        double sMetal = 0;
        double sElec = 0;
        double sTrans = 0;
        double sSub = 0;
        double sSca = 0;
        double sQuench = 0;
        double sR = 0;
        double sT = 0;
        double sPlanar = 0;
        boolean planarRef = m.oPlanar >= 0;
        capped = 0;
        for (int i = 0; i < nw; i++) {
            clearWavelength();
            int passes = 1;
            if (particlesOn) {
                particlesAt(i, true);
                passes = particleStep.passes();
            }
            double wgt = 1.0 / passes;
            for (int pass = 0; pass < passes; pass++) {
                solvePass(i, pass, wgt, rec);
            }
            double phi = m.flux[i];
            double planarCol = wCol * etaD;
            if (m.usesTable) {
                double s = applyEnhancement(i);
                if (rec != null) {
                    rec.profile(i, 1, lastEntry * s, stack, this);
                }
            }
            double col = wCol * etaD;
            sCol += phi * col;
            sOpt += phi * wOpt;
            sMetal += phi * wMetal;
            sElec += phi * wBucket[DeviceModel.B_ELECTRODE];
            sTrans += phi * wBucket[DeviceModel.B_TRANSPORT];
            sSub += phi * (wBucket[DeviceModel.B_SUBSTRATE] + wGlass);
            sSca += phi * wLost;
            sQuench += phi * wQuench;
            sR += phi * wR;
            sT += phi * wT;
            if (rec != null) {
                rec.record(i, wR, wT, wGlass, wLayer, wMetal, wSca, wHost, wQuench, wNf, wDiff, wLost, col);
                rec.hostLayer(i, wHost, wQuench, this);
            }
            if (planarRef) {
                sPlanar += phi * (particlesOn ? planarCollected(i) : planarCol);
            }
        }
        double jsc = SolarSpectrum.toMilliampPerCm2(sCol);
        double jOpt = SolarSpectrum.toMilliampPerCm2(sOpt);
        out[m.oJsc] = jsc;
        out[m.oJscOptical] = jOpt;
        out[m.oAbsorptance] = (sOpt + sQuench) / m.totalFlux;
        out[m.oMetal] = SolarSpectrum.toMilliampPerCm2(sMetal);
        out[m.oElectrodes] = SolarSpectrum.toMilliampPerCm2(sElec);
        out[m.oTransport] = SolarSpectrum.toMilliampPerCm2(sTrans);
        out[m.oSubstrate] = SolarSpectrum.toMilliampPerCm2(sSub);
        out[m.oScattering] = SolarSpectrum.toMilliampPerCm2(sSca);
        out[m.oQuenching] = SolarSpectrum.toMilliampPerCm2(sQuench);
        out[m.oCollection] = jOpt - jsc;
        out[m.oReflection] = SolarSpectrum.toMilliampPerCm2(sR);
        out[m.oTransmission] = SolarSpectrum.toMilliampPerCm2(sT);
        if (planarRef) {
            double jp = SolarSpectrum.toMilliampPerCm2(sPlanar);
            out[m.oPlanar] = jp;
            out[m.oEnhancement] = jp > 0 ? jsc / jp : (jsc > 0 ? Double.POSITIVE_INFINITY : 1.0);
        }
        if (m.hasDiode) {
            double j0 = v[m.dJ0];
            double n = v[m.dIdeality];
            double rs = v[m.dRs];
            double rsh = v[m.dRsh];
            double t = v[m.dTemperature];
            String why = OneDiode.check(jsc, j0, n, rs, rsh, t);
            if (why != null) {
                int slot = jsc >= 0 ? diodeSlot(j0, n, rs, rsh) : -1;
                throw new DeviceModel.InputException("out-of-range", slot, why);
            }
            OneDiode.solve(jsc, j0, n, rs, rsh, t, diode);
            out[m.oVoc] = diode[OneDiode.VOC];
            out[m.oFf] = diode[OneDiode.FF];
            out[m.oEfficiency] = diode[OneDiode.EFFICIENCY];
        }
    }

    private int diodeSlot(double j0, double n, double rs, double rsh) {
        if (!(j0 > 0) || Double.isInfinite(j0)) {
            return m.dJ0;
        }
        if (!(n > 0) || Double.isInfinite(n)) {
            return m.dIdeality;
        }
        if (!(rs >= 0) || Double.isInfinite(rs)) {
            return m.dRs;
        }
        if (!(rsh > 0)) {
            return m.dRsh;
        }
        return m.dTemperature;
    }

    private void clearWavelength() {
        wR = 0;
        wT = 0;
        wGlass = 0;
        for (int j = 0; j < nl; j++) {
            wLayer[j] = 0;
        }
        wBucket[0] = 0;
        wBucket[1] = 0;
        wBucket[2] = 0;
        wBucket[3] = 0;
        wOpt = 0;
        wCol = 0;
        wMetal = 0;
        wSca = 0;
        wHost = 0;
        wQuench = 0;
        wNf = 0;
        wDiff = 0;
        wLost = 0;
    }

    /** Fills the computational layers' n, k at wavelength i (the effective layer from the pass). */
    private void fillLayers(int i, int pass, boolean planar) {
        for (int c = 0; c < nc; c++) {
            int j = m.compLayer[c];
            if (m.compKind[c] == DeviceModel.K_EFFECTIVE && !planar && particlesOn) {
                nRe[c] = particleStep.effectiveN(pass);
                nIm[c] = particleStep.effectiveK(pass);
            } else {
                nRe[c] = m.optics.n(j, i) + shift[j];
                nIm[c] = m.optics.k(j, i) * scale[j];
            }
        }
    }

    /** Solves the main stack at wavelength i; returns the substrate entry factor (1 without one). */
    private double solveMain(int i, double[] thick) {
        double lam = m.lambda[i];
        if (m.incoherentGlass) {
            double ng = m.optics.n(0, i) + shift[0];
            double kg = m.optics.k(0, i) * scale[0];
            stack.solve(lam, ng, nc, nRe, nIm, thick, 1.0, 0.0);
            double rc = stack.reflectance();
            double tc = stack.transmittance();
            double rAg = IncoherentSubstrate.fresnelNormal(1, 0, ng, kg);
            double tG = IncoherentSubstrate.singlePass(kg, dL[0], lam);
            glassR = IncoherentSubstrate.totalReflectance(rAg, tG, rc);
            glassT = IncoherentSubstrate.totalTransmittance(rAg, tG, rc, tc);
            glassA = IncoherentSubstrate.glassAbsorptance(rAg, tG, rc);
            return IncoherentSubstrate.entryFactor(rAg, tG, rc);
        }
        stack.solve(lam, 1.0, nc, nRe, nIm, thick, 1.0, 0.0);
        glassR = stack.reflectance();
        glassT = stack.transmittance();
        glassA = 0;
        return 1;
    }

    /** Hecht-weighted absorption of computational layer c (absorber part), before η_d and the entry factor. */
    private double weighted(int c) {
        int j = m.compLayer[c];
        double[] cc = compCoef[c];
        double[] ss = hs[j];
        double s = 0;
        for (int t = 0; t < HechtCollection.TERMS; t++) {
            s += cc[t] * stack.absorbedWeighted(c, ss[t]);
        }
        return s;
    }

    private void solvePass(int i, int pass, double wgt, SpectraRecorder rec) {
        fillLayers(i, pass, false);
        double f = solveMain(i, dC);
        wR += wgt * glassR;
        wT += wgt * glassT;
        wGlass += wgt * glassA;
        for (int c = 0; c < nc; c++) {
            if (m.compKind[c] == DeviceModel.K_EFFECTIVE) {
                continue;
            }
            int j = m.compLayer[c];
            double a = f * stack.absorptance(c);
            wLayer[j] += wgt * a;
            if (m.isAbsorber[j]) {
                wOpt += wgt * a;
                if (a != 0) {
                    wCol += wgt * f * weighted(c);
                }
            } else {
                wBucket[m.bucket[j]] += wgt * a;
            }
        }
        lastEntry = f;
        if (rec != null && !m.usesTable) {
            rec.profile(i, wgt, f, stack, this);
        }
        if (!particlesOn) {
            return;
        }
        double ap = f * stack.absorptance(m.effComp);
        double metal = ap * particleStep.metalShare(pass);
        double sca = ap * particleStep.scatteringShare(pass);
        double hostPart = ap * particleStep.hostShare(pass);
        double quench = ap * particleStep.quenchedShare(pass);
        double nf = ap * particleStep.nearFieldShare(pass);
        wMetal += wgt * metal;
        wSca += wgt * sca;
        wHost += wgt * hostPart;
        wQuench += wgt * quench;
        wNf += wgt * nf;
        if (m.isAbsorber[m.host]) {
            wOpt += wgt * hostPart;
            wCol += wgt * hostPart * hostAverageEta;
        } else {
            wBucket[m.bucket[m.host]] += wgt * hostPart;
        }
        wOpt += wgt * nf;
        wCol += wgt * nf * nearFieldEta;
        if (sca > 0) {
            diffuse(i, sca, wgt);
        }
    }

    /** Redistributes scattered light {@code sca} into the diffuse absorber (Lambertian slab). */
    private void diffuse(int i, double sca, double wgt) {
        int t = m.diffuseAbsorber;
        double lam = m.lambda[i];
        double n = m.optics.n(t, i) + shift[t];
        double k = m.optics.k(t, i) * scale[t];
        double kappaD = FOUR_PI * k / lam * dL[t];
        double t1 = LambertianSlab.diffuseTransmission(kappaD);
        double rf = LambertianSlab.escapeConeReflectance(n, 1.0);
        // back reflectance: everything behind the absorber, seen from inside it
        int first = m.compOfLayerLast[t] + 1;
        int cnt = nc - first;
        double rb;
        if (cnt > 0) {
            // the main solve's sweep has already reached the absorber's back face: bit for bit the same
            // reflectance as solving the layers behind it again
            rb = stack.reflectanceBehind(first, n);
        } else {
            back.solve(lam, n, 0, NONE, NONE, NONE, 1.0, 0.0);
            rb = back.reflectance();
        }
        double absorbed;
        double lost;
        if (m.host < t) {
            double in = fFwd + (1 - fFwd) * rf;
            absorbed = in * LambertianSlab.absorbedFront(t1, rb, rf);
            lost = in * (LambertianSlab.escapedFront(t1, rb, rf) + LambertianSlab.lostBackFront(t1, rb, rf))
                    + (1 - fFwd) * (1 - rf);
        } else if (m.host > t) {
            double in = fFwd + (1 - fFwd) * rb;
            absorbed = in * LambertianSlab.absorbedBack(t1, rb, rf);
            lost = in * (LambertianSlab.escapedBack(t1, rb, rf) + LambertianSlab.lostBackBack(t1, rb, rf))
                    + (1 - fFwd) * (1 - rb);
        } else {
            absorbed = fFwd * LambertianSlab.absorbedFront(t1, rb, rf)
                    + (1 - fFwd) * LambertianSlab.absorbedBack(t1, rb, rf);
            lost = fFwd * (LambertianSlab.escapedFront(t1, rb, rf) + LambertianSlab.lostBackFront(t1, rb, rf))
                    + (1 - fFwd) * (LambertianSlab.escapedBack(t1, rb, rf) + LambertianSlab.lostBackBack(t1, rb, rf));
        }
        double diff = sca * absorbed;
        wDiff += wgt * diff;
        wLost += wgt * sca * lost;
        wOpt += wgt * diff;
        wCol += wgt * diff * avgEta[t];
    }

    /** Collected fraction (η_d included) of the planar stack (no particles) at wavelength i. */
    private double planarCollected(int i) {
        fillLayers(i, 0, true);
        double f = solveMain(i, dPlanar);
        double col = 0;
        for (int c = 0; c < nc; c++) {
            int j = m.compLayer[c];
            if (m.isAbsorber[j] && m.compKind[c] != DeviceModel.K_EFFECTIVE && dPlanar[c] > 0) {
                double[] cc = compCoef[c];
                double[] ss = hs[j];
                // the planar host keeps its whole thickness in the front part, offset 0
                double s = 0;
                for (int tt = 0; tt < HechtCollection.TERMS; tt++) {
                    s += cc[tt] * stack.absorbedWeighted(c, ss[tt]);
                }
                col += f * s;
            }
        }
        return col * etaD;
    }

    // accessors for the recorder
    int compCount() {
        return nc;
    }

    double compThickness(int c) {
        return dC[c];
    }

    double compOffset(int c) {
        return x0[c];
    }

    double layerThickness(int j) {
        return dL[j];
    }

    boolean particlesOn() {
        return particlesOn;
    }

    double height() {
        return height;
    }

    double offset() {
        return offset;
    }
}

package org.fabspread.particles;

/**
 * The quadrature nodes of one particle ensemble and everything about them that depends on size and shape
 * but not on the wavelength: the lognormal size spread by Gauss–Hermite quadrature (model document §4.3),
 * the semi-axes, volumes and mean free paths of each node, the layer's geometry (h, n_A, ⟨V⟩, ⟨ab⟩) and
 * the wavelength-free terms of each node's size-corrected permittivity ({@link MetalPermittivity}).
 *
 * <p>Size and shape: D_i = D₅₀ exp(√2 σ_ln x_i), σ_ln = √(ln(1 + CV²)), weight w_i/√π; semi-axes
 * a = (D/2)(p/q)^{1/3}, b = a/p, c = q a; n_A = θ/(π⟨ab⟩), h = 2c(D₅₀). Mutable scratch of one
 * {@link ParticleEnsemble}; set once per sample, read by the wavelength loop.
 */
final class EnsembleNodes {
    final GaussHermite rule;
    final int maxNodes;
    final double[] weight;
    final double[] diameter;
    /** Semi-axis j of node i at [3i + j]. */
    final double[] axes;
    final double[] volume;
    final double[] meanFreePath;
    final double[] radius;
    final double[] invR3;
    final double[] invVolume;
    /** 1/(4π a_j) of node i at [3i + j] (MLWA dynamic depolarisation). */
    final double[] invFourPiAxis;
    /** ħ²ω_p² ħΔγ, ħγ₀ ħγ and ħγ₀ + ħγ of node i (size correction, {@link MetalPermittivity#sizeCorrected}). */
    final double[] dampNum;
    final double[] dampProd;
    final double[] dampSum;
    final double[] depol = new double[3];
    boolean sizeCorrection;
    int active;

    double d50;
    double cv;
    double inPlane;
    double outOfPlane;
    double coverage;
    double thickness;
    double numberPerArea;
    double meanVolume;
    double meanAb;
    boolean sphere;

    EnsembleNodes(int nodes) {
        rule = GaussHermite.of(nodes);
        maxNodes = nodes;
        weight = new double[nodes];
        diameter = new double[nodes];
        axes = new double[3 * nodes];
        volume = new double[nodes];
        meanFreePath = new double[nodes];
        radius = new double[nodes];
        invR3 = new double[nodes];
        invVolume = new double[nodes];
        invFourPiAxis = new double[3 * nodes];
        dampNum = new double[nodes];
        dampProd = new double[nodes];
        dampSum = new double[nodes];
    }

    /** Sets the nodes for one size distribution and shape (arguments already checked). Allocation-free. */
    void setShape(double medianDiameterNm, double sizeCv, double inPlaneAspect, double outOfPlaneAspect,
                  double coverageFraction) {
        d50 = medianDiameterNm;
        cv = sizeCv;
        inPlane = inPlaneAspect;
        outOfPlane = outOfPlaneAspect;
        coverage = coverageFraction;
        double sigmaLn = Math.sqrt(Math.log1p(sizeCv * sizeCv));
        sphere = inPlaneAspect == 1 && outOfPlaneAspect == 1;
        double aUnit = 0.5 * Math.cbrt(inPlaneAspect / outOfPlaneAspect);
        double bUnit = aUnit / inPlaneAspect;
        double cUnit = outOfPlaneAspect * aUnit;
        if (sphere) {
            aUnit = 0.5;
            bUnit = 0.5;
            cUnit = 0.5;
        }
        Depolarization.factors(aUnit, bUnit, cUnit, depol);
        double lUnit = MetalPermittivity.meanFreePath(aUnit, bUnit, cUnit);
        active = sizeCv == 0 ? 1 : maxNodes;
        double sv = 0;
        double sab = 0;
        for (int i = 0; i < active; i++) {
            double d = active == 1 ? medianDiameterNm : medianDiameterNm * Math.exp(Math.sqrt(2) * sigmaLn * rule.node(i));
            weight[i] = active == 1 ? 1 : rule.weight(i);
            diameter[i] = d;
            axes[3 * i] = aUnit * d;
            axes[3 * i + 1] = bUnit * d;
            axes[3 * i + 2] = cUnit * d;
            volume[i] = Math.PI * d * d * d / 6;
            meanFreePath[i] = lUnit * d;
            sv += weight[i] * volume[i];
            sab += weight[i] * axes[3 * i] * axes[3 * i + 1];
            double r = 0.5 * d;
            radius[i] = r;
            invR3[i] = 1 / (r * r * r);
            invVolume[i] = 1 / volume[i];
            for (int j = 0; j < 3; j++) {
                invFourPiAxis[3 * i + j] = 1 / (4 * Math.PI * axes[3 * i + j]);
            }
        }
        meanVolume = sv;
        meanAb = sab;
        thickness = 2 * cUnit * medianDiameterNm;
        numberPerArea = coverageFraction / (Math.PI * sab);
    }

    /** The wavelength-free terms of the size correction per node (once per sample). */
    void prepareDamping(double plasmaEv, double dampingEv, double fermiVelocity, double surfaceA) {
        sizeCorrection = surfaceA > 0 && fermiVelocity > 0;
        if (!sizeCorrection) {
            return;
        }
        for (int i = 0; i < active; i++) {
            double dg = MetalPermittivity.surfaceDampingEv(meanFreePath[i], fermiVelocity, surfaceA);
            double g = dampingEv + dg;
            dampNum[i] = plasmaEv * plasmaEv * dg;
            dampProd[i] = dampingEv * g;
            dampSum[i] = dampingEv + g;
        }
    }

    /** ⟨D²⟩ from the quadrature (nm²). */
    double meanDiameterSquared() {
        double s = 0;
        for (int i = 0; i < active; i++) {
            s += weight[i] * diameter[i] * diameter[i];
        }
        return s;
    }
}

package org.fabspread.optics;

/**
 * Coherent transfer-matrix solver for a stack of thin homogeneous isotropic layers at normal
 * incidence: the characteristic-matrix method of Born &amp; Wolf, <i>Principles of Optics</i>, ch. 1.6,
 * in the field-amplitude form of Pettersson, Roman &amp; Inganäs, J. Appl. Phys. 86, 487 (1999) and
 * Byrnes, arXiv:1603.02720.
 *
 * <p>Conventions: time dependence e<sup>−iωt</sup>, complex index N = n + ik (k ≥ 0 absorbs),
 * a forward wave in layer j is F e<sup>iβx</sup> with β = 2πN/λ. Light arrives from a semi-infinite
 * medium of real index n<sub>0</sub>, crosses layers 0..count−1 and leaves into a semi-infinite exit
 * medium. All fields are normalised to the incident forward amplitude E<sub>0</sub> at the first
 * interface, and every power to the incident power n<sub>0</sub>|E<sub>0</sub>|².
 *
 * <p>The solver starts from a unit forward wave in the exit medium and carries (E, H) back to the
 * incident medium, so it never inverts a matrix; a running power-of-two rescaling keeps thick
 * absorbing stacks from overflowing. Inside layer j the field is stored as its forward amplitude F at
 * the front face and its backward amplitude B at the back face, so that
 * |E(x)|² = |F|² e<sup>−αx</sup> + |B|² e<sup>−α(d−x)</sup> + 2 Re(C e<sup>2iβ'x</sup>),
 * α = 4πk/λ, β' = 2πn/λ, C = F B* e<sup>−iβ'd</sup> e<sup>−αd/2</sup>: two real exponentials and a
 * cosine, which {@link #absorbedWeighted} integrates against e<sup>sx</sup> in closed form.
 *
 * <p>Layer absorptances are computed from that closed-form integral of the local absorption rate, not
 * from Poynting-flux differences, so R + T + Σ A<sub>j</sub> = 1 is an independent check of the solution.
 *
 * <p>One instance per thread: {@link #solve} overwrites internal scratch arrays and allocates nothing.
 */
public final class CoherentStack {
    /** Largest single-pass amplitude attenuation exponent 2πkd/λ a layer may have. */
    private static final double MAX_LAYER_EXPONENT = 300;
    private static final double TWO_PI = 2 * Math.PI;

    private final int maxLayers;
    private final FieldSweep sweep = new FieldSweep();
    // per-layer state of the last solve
    private final double[] fRe;
    private final double[] fIm;
    private final double[] bRe;
    private final double[] bIm;
    private final int[] scaleExp;
    private final double[] thick;
    private final double[] theta;   // β' d
    private final double[] gamma;   // β'' d = α d / 2
    private final double[] cosT;
    private final double[] sinT;
    private final double[] expmG;   // expm1(-gamma)
    private final double[] expG;    // exp(-gamma)
    private final double[] pref;    // 4π n k / (λ n0), per nm
    private final double[] absorbed;
    private final double[] layerN;
    private final double[] layerK;
    // (E, H) at the front face of each layer during the backward sweep, with its rescaling count
    private final double[] eFrontRe;
    private final double[] eFrontIm;
    private final double[] hFrontRe;
    private final double[] hFrontIm;

    // e^w and e^w − 1 of the last few weighting exponents w = s d (they change with the sample, not the
    // wavelength): a pure function of w, so a hit returns exactly what a fresh evaluation would
    private static final int W_SLOTS = 8;
    private final long[] wKey = new long[W_SLOTS];
    private final double[] wExp = new double[W_SLOTS];
    private final double[] wExpm1 = new double[W_SLOTS];
    private int wNext;

    private int count;
    private double lambda;
    private double n0;
    private double reflectance;
    private double transmittance;
    private double rRe;
    private double rIm;
    private double tRe;
    private double tIm;
    private boolean solved;
    /** layers that, at zero thickness, pass the field on exactly (null: none); see {@link #passWhenEmpty}. */
    private boolean[] passEmpty;

    public CoherentStack(int maxLayers) {
        if (maxLayers < 0) {
            throw new IllegalArgumentException("maxLayers must be >= 0, got " + maxLayers);
        }
        this.maxLayers = maxLayers;
        fRe = new double[maxLayers];
        fIm = new double[maxLayers];
        bRe = new double[maxLayers];
        bIm = new double[maxLayers];
        scaleExp = new int[maxLayers];
        thick = new double[maxLayers];
        theta = new double[maxLayers];
        gamma = new double[maxLayers];
        cosT = new double[maxLayers];
        sinT = new double[maxLayers];
        expmG = new double[maxLayers];
        expG = new double[maxLayers];
        pref = new double[maxLayers];
        absorbed = new double[maxLayers];
        layerN = new double[maxLayers];
        layerK = new double[maxLayers];
        eFrontRe = new double[maxLayers];
        eFrontIm = new double[maxLayers];
        hFrontRe = new double[maxLayers];
        hFrontIm = new double[maxLayers];
        java.util.Arrays.fill(wKey, Double.doubleToRawLongBits(Double.NaN));
    }

    /** The slot holding e^w and e^w − 1 (computed on a miss); keyed by the bits of w, so −0 is not +0. */
    private int expSlot(double w) {
        final long bits = Double.doubleToRawLongBits(w);
        for (int k = 0; k < W_SLOTS; k++) {
            if (wKey[k] == bits) {
                return k;
            }
        }
        int k = wNext;
        wNext = (k + 1) % W_SLOTS;
        wKey[k] = bits;
        wExp[k] = Math.exp(w);
        wExpm1[k] = Math.expm1(w);
        return k;
    }

    /**
     * Marks layers that exist only sometimes (a slice whose thickness is zero in most solves): at zero
     * thickness such a layer leaves the field exactly as it is instead of splitting and recombining it, so a
     * stack with it empty gives bit for bit the numbers of the stack without it. Other layers of zero thickness
     * are crossed as before. A copy of the mask is kept; null clears it.
     */
    public void passWhenEmpty(boolean[] mask) {
        if (mask != null && mask.length > maxLayers) {
            throw new IllegalArgumentException("mask of " + mask.length + " layers, at most " + maxLayers);
        }
        passEmpty = mask == null ? null : mask.clone();
    }

    /** The largest layer count {@link #solve} accepts. */
    public int maxLayers() {
        return maxLayers;
    }

    /**
     * Solves the stack at one vacuum wavelength.
     *
     * @param lambdaNm vacuum wavelength, nm
     * @param n0       real index of the incident medium (1 for air, Re n of the glass behind an incoherent substrate)
     * @param count    number of layers (≤ maxLayers)
     * @param nRe      n of layers 0..count−1
     * @param nIm      k of layers 0..count−1 (≥ 0)
     * @param dNm      thicknesses, nm (≥ 0; zero is allowed)
     * @param exitRe   n of the exit medium
     * @param exitIm   k of the exit medium
     */
    public void solve(double lambdaNm, double n0, int count, double[] nRe, double[] nIm, double[] dNm,
                      double exitRe, double exitIm) {
        if (count > maxLayers || count < 0) {
            throw new IllegalArgumentException("layer count " + count + " outside 0.." + maxLayers);
        }
        if (!(lambdaNm > 0) || !(n0 > 0)) {
            throw new IllegalArgumentException("need lambda > 0 and n0 > 0, got " + lambdaNm + ", " + n0);
        }
        this.count = count;
        this.lambda = lambdaNm;
        this.n0 = n0;
        final double k0 = TWO_PI / lambdaNm;
        final double prefBase = 2 * k0 / n0; // 4π/(λ n0)

        // unit forward wave in the exit medium at the last interface: E = 1, H = N_exit E
        final FieldSweep w = sweep;
        w.start(exitRe, exitIm);
        for (int j = count - 1; j >= 0; j--) {
            final double nr = nRe[j];
            final double ni = nIm[j];
            final double d = dNm[j];
            final double th = k0 * nr * d;
            final double g = k0 * ni * d;
            if (!(g <= MAX_LAYER_EXPONENT)) {
                throw new IllegalArgumentException("layer " + j + " is optically opaque beyond computation (2πkd/λ = "
                        + g + " > " + MAX_LAYER_EXPONENT + "); make it the exit medium instead");
            }
            // e^{iθ} from one tangent of the half angle: cos θ = (1 − t²)/(1 + t²), sin θ = 2t/(1 + t²)
            // (tan 0 = 0 and e^0 = 1 exactly: the shortcuts give the same bits, without the calls)
            final double t = th == 0 ? th : Math.tan(0.5 * th);
            final double u = 1 / (1 + t * t);
            final double c = (1 - t * t) * u;
            final double s = 2 * t * u;
            // e^{-g} and e^{-g} − 1, the latter without cancellation for small g
            final double em = g == 0 ? 1.0 : Math.exp(-g);
            final double q = g < 0.01 ? expm1Small(-g) : em - 1;
            // at normal incidence the admittance is N itself
            scaleExp[j] = w.exp;
            if (d == 0 && passEmpty != null && j < passEmpty.length && passEmpty[j]) {
                w.passEmpty(nr, ni);
            } else {
                w.cross(nr, ni, c, s, em);
            }
            fRe[j] = w.fRe;
            fIm[j] = w.fIm;
            bRe[j] = w.bRe;
            bIm[j] = w.bIm;
            thick[j] = d;
            theta[j] = th;
            gamma[j] = g;
            cosT[j] = c;
            sinT[j] = s;
            expmG[j] = q;
            expG[j] = em;
            pref[j] = prefBase * nr * ni;
            layerN[j] = nr;
            layerK[j] = ni;
            // the field at this layer's front face, for reflectanceBehind (after any rescaling)
            eFrontRe[j] = w.eRe;
            eFrontIm[j] = w.eIm;
            hFrontRe[j] = w.hRe;
            hFrontIm[j] = w.hIm;
        }
        final int exp = w.exp;
        // incident medium: F0 = (E + H/n0)/2, B0 = (E - H/n0)/2
        w.split(n0);
        final double f0Re = w.f0Re;
        final double f0Im = w.f0Im;
        final double b0Re = w.b0Re;
        final double b0Im = w.b0Im;
        final double f0Inv = 1.0 / (f0Re * f0Re + f0Im * f0Im);
        // 1/F0
        final double iRe = f0Re * f0Inv;
        final double iIm = -f0Im * f0Inv;
        rRe = b0Re * iRe - b0Im * iIm;
        rIm = b0Re * iIm + b0Im * iRe;
        reflectance = rRe * rRe + rIm * rIm;
        final double tScale = FieldSweep.unscale(exp);
        tRe = iRe * tScale;
        tIm = iIm * tScale;
        transmittance = exitRe * (tRe * tRe + tIm * tIm) / n0;

        for (int j = 0; j < count; j++) {
            final double sc = exp == scaleExp[j] ? 1.0 : FieldSweep.unscale(exp - scaleExp[j]);
            final double aRe = iRe * sc;
            final double aIm = iIm * sc;
            double x = fRe[j];
            double y = fIm[j];
            fRe[j] = x * aRe - y * aIm;
            fIm[j] = x * aIm + y * aRe;
            x = bRe[j];
            y = bIm[j];
            bRe[j] = x * aRe - y * aIm;
            bIm[j] = x * aIm + y * aRe;
            absorbed[j] = pref[j] == 0 ? 0.0 : absorbedAtZero(j);
        }
        solved = true;
    }

    /**
     * Reflectance of the part of the last solved stack from layer j on (layers j … count−1 and the exit
     * medium), seen from a semi-infinite medium of real index {@code nIn} in front of layer j. The
     * backward sweep of {@link #solve} has already carried the field to that face, so this costs no
     * second solve, and it equals bit for bit what {@code solve} of those layers with incident index
     * {@code nIn} would report (that solve's sweep is the same operations on the same numbers, rescaling
     * included, and ends with the same incident-medium step).
     */
    public double reflectanceBehind(int j, double nIn) {
        requireSolved(j);
        if (!(nIn > 0)) {
            throw new IllegalArgumentException("need nIn > 0, got " + nIn);
        }
        final double eRe = eFrontRe[j];
        final double eIm = eFrontIm[j];
        final double hRe = hFrontRe[j];
        final double hIm = hFrontIm[j];
        final double f0Re = 0.5 * (eRe + hRe / nIn);
        final double f0Im = 0.5 * (eIm + hIm / nIn);
        final double b0Re = 0.5 * (eRe - hRe / nIn);
        final double b0Im = 0.5 * (eIm - hIm / nIn);
        final double f0Inv = 1.0 / (f0Re * f0Re + f0Im * f0Im);
        final double iRe = f0Re * f0Inv;
        final double iIm = -f0Im * f0Inv;
        final double re = b0Re * iRe - b0Im * iIm;
        final double im = b0Re * iIm + b0Im * iRe;
        return re * re + im * im;
    }

    /** ∫ a(x) dx over layer j from the cached trigonometric and exponential factors of the solve. */
    private double absorbedAtZero(int j) {
        final double d = thick[j];
        if (d == 0) {
            return 0;
        }
        final double g = gamma[j];
        final double q = expmG[j];
        final double em = expG[j];
        // ∫_0^d e^{-αx} dx / d = (1 - e^{-2g}) / (2g), with 1 - e^{-2g} = -q(2+q)
        final double phi = g == 0 ? 1.0 : -q * (2 + q) / (2 * g);
        final double ff = fRe[j] * fRe[j] + fIm[j] * fIm[j];
        final double bb = bRe[j] * bRe[j] + bIm[j] * bIm[j];
        // C = F B* e^{-iθ} e^{-g}
        final double c = cosT[j];
        final double s = sinT[j];
        final double pRe = fRe[j] * bRe[j] + fIm[j] * bIm[j];
        final double pIm = fIm[j] * bRe[j] - fRe[j] * bIm[j];
        final double cRe = em * (pRe * c + pIm * s);
        final double cIm = em * (pIm * c - pRe * s);
        // (e^{2iθ} - 1)/(2iθ) = sinθ cosθ/θ + i sin²θ/θ
        final double th = theta[j];
        final double sinc = th == 0 ? 1.0 : s / th;
        final double phRe = sinc * c;
        final double phIm = sinc * s;
        return pref[j] * d * ((ff + bb) * phi + 2 * (cRe * phRe - cIm * phIm));
    }

    private void requireSolved(int j) {
        if (!solved) {
            throw new IllegalStateException("solve() has not been called");
        }
        if (j < 0 || j >= count) {
            throw new IndexOutOfBoundsException("layer " + j + " outside 0.." + (count - 1));
        }
    }

    private void requireSolved() {
        if (!solved) {
            throw new IllegalStateException("solve() has not been called");
        }
    }

    /** Layers of the last solve. */
    public int count() {
        return count;
    }

    /** Reflectance |r|² into the incident medium. */
    public double reflectance() {
        requireSolved();
        return reflectance;
    }

    /** Transmittance into the exit medium, Re(N_exit)|t|²/n0. */
    public double transmittance() {
        requireSolved();
        return transmittance;
    }

    /** Real part of the amplitude reflection coefficient r = B0/F0. */
    public double reflectionRe() {
        requireSolved();
        return rRe;
    }

    /** Imaginary part of the amplitude reflection coefficient. */
    public double reflectionIm() {
        requireSolved();
        return rIm;
    }

    /** Real part of the amplitude transmission coefficient (forward field in the exit medium / E0). */
    public double transmissionRe() {
        requireSolved();
        return tRe;
    }

    /** Imaginary part of the amplitude transmission coefficient. */
    public double transmissionIm() {
        requireSolved();
        return tIm;
    }

    /** Fraction of the incident power absorbed in layer j. */
    public double absorptance(int j) {
        requireSolved(j);
        return absorbed[j];
    }

    /** Thickness of layer j in the last solve, nm. */
    public double thickness(int j) {
        requireSolved(j);
        return thick[j];
    }

    /** Absorption coefficient α = 4πk/λ of layer j, per nm. */
    public double absorptionCoefficient(int j) {
        requireSolved(j);
        return 2 * TWO_PI * layerK[j] / lambda;
    }

    /**
     * |E(x)/E0|² at depth x (nm, from the front face of layer j), from the complex field
     * F e<sup>iβx</sup> + B e<sup>−iβ(x−d)</sup>.
     */
    public double fieldIntensity(int j, double xNm) {
        requireSolved(j);
        final double d = thick[j];
        if (!(xNm >= 0 && xNm <= d)) {
            throw new IllegalArgumentException("depth " + xNm + " nm outside layer " + j + " (0.." + d + " nm)");
        }
        final double k0 = TWO_PI / lambda;
        final double nr = layerN[j];
        final double ni = layerK[j];
        // forward: F e^{-k0 ni x} e^{i k0 nr x}
        double mag = Math.exp(-k0 * ni * xNm);
        double ph = k0 * nr * xNm;
        double c = Math.cos(ph);
        double s = Math.sin(ph);
        double eRe = mag * (fRe[j] * c - fIm[j] * s);
        double eIm = mag * (fRe[j] * s + fIm[j] * c);
        // backward: B e^{-k0 ni (d-x)} e^{i k0 nr (d-x)}
        mag = Math.exp(-k0 * ni * (d - xNm));
        ph = k0 * nr * (d - xNm);
        c = Math.cos(ph);
        s = Math.sin(ph);
        eRe += mag * (bRe[j] * c - bIm[j] * s);
        eIm += mag * (bRe[j] * s + bIm[j] * c);
        return eRe * eRe + eIm * eIm;
    }

    /** Local absorption rate a(x) = (4πnk/λ)|E(x)/E0|²/n0 per nm, normalised to the incident power. */
    public double absorptionRate(int j, double xNm) {
        requireSolved(j);
        return pref[j] == 0 ? 0.0 : pref[j] * fieldIntensity(j, xNm);
    }

    /**
     * ∫<sub>0</sub><sup>d</sup> a(x) e<sup>sx</sup> dx over layer j, x measured from its front face, in
     * closed form. {@code absorbedWeighted(j, 0)} equals {@link #absorptance(int)}.
     *
     * @param sPerNm exponent rate s, per nm (any sign; e<sup>sd</sup> must stay finite)
     */
    public double absorbedWeighted(int j, double sPerNm) {
        return absorbedWeighted(j, sPerNm, false);
    }

    /**
     * ∫<sub>0</sub><sup>d</sup> a(x) e<sup>s(d−x)</sup> dx over layer j: the same weighting measured from
     * the back face, for weights that decay away from the back (e.g. e<sup>−(d−x)/ℓ</sup>) without
     * overflowing e<sup>sd</sup>.
     */
    public double absorbedWeightedFromBack(int j, double sPerNm) {
        return absorbedWeighted(j, sPerNm, true);
    }

    /**
     * The weighted integral from the front face or, mirrored, from the back face: u = d − x swaps F and
     * B, and C becomes conj(C e<sup>2iθ</sup>) with C e<sup>2iθ</sup> = F B* e<sup>iθ</sup> e<sup>−g</sup>.
     */
    private double absorbedWeighted(int j, double sPerNm, boolean fromBack) {
        requireSolved(j);
        if (pref[j] == 0 || thick[j] == 0) {
            return 0;
        }
        final double ff = fRe[j] * fRe[j] + fIm[j] * fIm[j];
        final double bb = bRe[j] * bRe[j] + bIm[j] * bIm[j];
        final double em = expG[j];
        final double pRe = fRe[j] * bRe[j] + fIm[j] * bIm[j];
        final double pIm = fIm[j] * bRe[j] - fRe[j] * bIm[j];
        final double c = cosT[j];
        // e^{-iθ} from the front, e^{+iθ} from the back
        final double s = fromBack ? -sinT[j] : sinT[j];
        final double cRe = em * (pRe * c + pIm * s);
        final double cIm = em * (pIm * c - pRe * s);
        return fromBack ? pref[j] * weighted(bb, ff, cRe, -cIm, j, sPerNm)
                : pref[j] * weighted(ff, bb, cRe, cIm, j, sPerNm);
    }

    /**
     * ∫_0^d [ff e^{-αx} + bb e^{-α(d-x)} + 2 Re(C e^{2iβ'x})] e^{sx} dx.
     */
    private double weighted(double ff, double bb, double cRe, double cIm, int j, double sPerNm) {
        final double d = thick[j];
        final double g2 = 2 * gamma[j];  // α d
        final double w = sPerNm * d;
        // forward: d φ(w − αd)
        final double phiF = phi(w - g2);
        final double termF = ff * phiF;
        // backward: ∫ e^{sx} e^{-α(d-x)} dx / d, two exact forms chosen to avoid overflow
        final double z = w + g2;
        final int slot = expSlot(w);
        final double termB;
        if (z >= 0) {
            // at w = 0, −z and w − αd are the same number: φ once
            termB = bb * wExp[slot] * (w == 0 ? phiF : phi(-z));
        } else {
            termB = bb * expG[j] * expG[j] * phi(z);
        }
        // cross: 2 Re(C (e^{w + 2iθ} − 1)/(w + 2iθ))
        final double sn = sinT[j];
        final double cs = cosT[j];
        final double em1 = wExpm1[slot];
        final double ea = 1 + em1;
        final double cos2 = 1 - 2 * sn * sn;
        final double sin2 = 2 * sn * cs;
        final double numRe = em1 * cos2 - 2 * sn * sn;
        final double numIm = ea * sin2;
        final double zRe = w;
        final double zIm = 2 * theta[j];
        final double phRe;
        final double phIm;
        final double zz = zRe * zRe + zIm * zIm;
        if (zz == 0) {
            phRe = 1;
            phIm = 0;
        } else {
            phRe = (numRe * zRe + numIm * zIm) / zz;
            phIm = (numIm * zRe - numRe * zIm) / zz;
        }
        final double termC = 2 * (cRe * phRe - cIm * phIm);
        return d * (termF + termB + termC);
    }

    /** e^x − 1 for |x| &lt; 0.01 by its Taylor series (truncation below 1e-18 relative). */
    private static double expm1Small(double x) {
        return x * (1 + x * (1.0 / 2 + x * (1.0 / 6 + x * (1.0 / 24 + x * (1.0 / 120 + x * (1.0 / 720 + x / 5040))))));
    }

    /** φ(z) = (e^z − 1)/z, 1 at z = 0. */
    private static double phi(double z) {
        return z == 0 ? 1.0 : Math.expm1(z) / z;
    }
}

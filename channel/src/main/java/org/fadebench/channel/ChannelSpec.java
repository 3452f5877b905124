package org.fadebench.channel;

/**
 * Everything the command line says about the channel: the fading model and its parameters, spatial
 * correlation, Doppler, the receiver's CSI, or a recorded trace. Immutable: each {@code with…}
 * returns a changed copy and checks its own value; {@link #check} checks the combination for a link
 * of Nr x Mt antennas. Messages start with the option they are about.
 *
 * <p>Option ↔ method: {@code --fading} {@link #of}, {@code --k-factor} {@link #withKFactor},
 * {@code --nakagami-m} {@link #withNakagamiM}, {@code --tx-corr} {@link #withTxCorr},
 * {@code --rx-corr} {@link #withRxCorr}, {@code --doppler} {@link #withDoppler},
 * {@code --csi-error} {@link #withCsiError}, {@code --pilots} {@link #withPilots},
 * {@code --trace} {@link #withTrace}.
 */
public final class ChannelSpec {

    private final Fading fading;
    /** NaN, null or 0 below: not given. */
    private double kFactor = Double.NaN;
    private double nakagamiM = Double.NaN;
    private double txCorr = Double.NaN;
    private double rxCorr = Double.NaN;
    private KroneckerCorrelation correlation;
    private double doppler = Double.NaN;
    private double csiError = Double.NaN;
    private int pilots;
    private ChannelTrace trace;

    private ChannelSpec(Fading fading) {
        this.fading = fading;
    }

    private ChannelSpec copy() {
        ChannelSpec c = new ChannelSpec(fading);
        c.kFactor = kFactor;
        c.nakagamiM = nakagamiM;
        c.txCorr = txCorr;
        c.rxCorr = rxCorr;
        c.correlation = correlation;
        c.doppler = doppler;
        c.csiError = csiError;
        c.pilots = pilots;
        c.trace = trace;
        return c;
    }

    /** A channel of the given fading kind, block fading, perfect CSI. */
    public static ChannelSpec of(Fading fading) {
        if (fading == null) {
            throw new IllegalArgumentException("--fading must be one of " + Fading.choices());
        }
        return new ChannelSpec(fading);
    }

    /** Rician line-of-sight factor K (linear), finite and ≥ 0; needs {@code --fading rician}. */
    public ChannelSpec withKFactor(double k) {
        ChannelSpec c = copy();
        c.kFactor = atLeast("--k-factor must be a finite linear K-factor >= 0", 0.0, k);
        return c;
    }

    /** Nakagami m, finite and ≥ 0.5; needs {@code --fading nakagami}. */
    public ChannelSpec withNakagamiM(double m) {
        ChannelSpec c = copy();
        c.nakagamiM = atLeast("--nakagami-m must be a finite Nakagami m >= 0.5", 0.5, m);
        return c;
    }

    /** Exponential correlation coefficient r in (−1, 1) between neighbouring transmit antennas. */
    public ChannelSpec withTxCorr(double r) {
        ChannelSpec c = copy();
        c.txCorr = coefficient("--tx-corr", r);
        return c;
    }

    /** Exponential correlation coefficient r in (−1, 1) between neighbouring receive antennas. */
    public ChannelSpec withRxCorr(double r) {
        ChannelSpec c = copy();
        c.rxCorr = coefficient("--rx-corr", r);
        return c;
    }

    /** Full correlation matrices (for library use; the CLI has the exponential profiles). */
    public ChannelSpec withCorrelation(KroneckerCorrelation correlation) {
        ChannelSpec c = copy();
        c.correlation = correlation;
        return c;
    }

    /** Normalised Doppler f_D·T_s in [0, 0.5]; above 0 the channel changes every slot. */
    public ChannelSpec withDoppler(double normalisedDoppler) {
        if (!(normalisedDoppler >= 0.0 && normalisedDoppler <= 0.5)) {
            throw new IllegalArgumentException("--doppler must be a normalised Doppler f_D·T_s in [0, 0.5], got "
                    + normalisedDoppler);
        }
        ChannelSpec c = copy();
        c.doppler = normalisedDoppler;
        return c;
    }

    /** CSI error variance σ² per entry (Ĥ = H + CN(0, σ²)), finite and ≥ 0. */
    public ChannelSpec withCsiError(double variance) {
        ChannelSpec c = copy();
        c.csiError = atLeast("--csi-error must be a finite error variance >= 0", 0.0, variance);
        return c;
    }

    /** Least-squares CSI from this many pilot slots per fading block, 1 to {@value CsiEstimator#MAX_PILOTS} (and ≥ Mt). */
    public ChannelSpec withPilots(int count) {
        if (count < 1 || count > CsiEstimator.MAX_PILOTS) {
            throw new IllegalArgumentException("--pilots must be 1 to " + CsiEstimator.MAX_PILOTS + " (and at least Mt), got "
                    + count);
        }
        ChannelSpec c = copy();
        c.pilots = count;
        return c;
    }

    /** Channel matrices from a recorded trace instead of a fading model (read it with {@link ChannelTrace#read}). */
    public ChannelSpec withTrace(ChannelTrace trace) {
        ChannelSpec c = copy();
        c.trace = trace;
        return c;
    }

    public Fading fading() {
        return fading;
    }

    /** The trace, or null. */
    public ChannelTrace trace() {
        return trace;
    }

    /** Whether the channel changes from slot to slot (Doppler above 0). */
    public boolean varies() {
        return doppler > 0.0;
    }

    /** Pilot slots per fading block (0 without {@code --pilots}). */
    public int pilots() {
        return pilots;
    }

    /**
     * The share of slots spent on pilots, N/(N + data slots per fading block); 0 without pilots.
     * Pilots are not charged to the SNR: report this beside the spectral efficiency (the net value is
     * the nominal one times 1 − overhead).
     */
    public double pilotOverhead(int dataSlotsPerBlock) {
        if (dataSlotsPerBlock < 1) {
            throw new IllegalArgumentException("data slots per block must be >= 1, got " + dataSlotsPerBlock);
        }
        return pilots == 0 ? 0.0 : (double) pilots / (pilots + dataSlotsPerBlock);
    }

    /**
     * Checks the combination of options for a link of {@code nr} receive and {@code mt} transmit
     * antennas.
     *
     * @throws IllegalArgumentException naming the option and what is wrong
     */
    public void check(int nr, int mt) {
        OutageBounds.checkAntennas(mt, nr);
        if (trace != null) {
            String other = given(kFactor) ? "--k-factor" : given(nakagamiM) ? "--nakagami-m"
                    : given(txCorr) ? "--tx-corr" : given(rxCorr) ? "--rx-corr"
                    : correlation != null ? "correlation matrices" : given(doppler) ? "--doppler" : null;
            if (other != null) {
                throw new IllegalArgumentException("--trace takes the channel from the file and cannot be combined with "
                        + other);
            }
            try {
                trace.requireShape(nr, mt);
                trace.requireLinkRange();
            } catch (IllegalArgumentException e) {
                throw new IllegalArgumentException("--trace " + e.getMessage(), e);
            }
        } else {
            if (fading == Fading.RICIAN && !given(kFactor)) {
                throw new IllegalArgumentException("--fading rician needs --k-factor (a linear K-factor >= 0)");
            }
            if (fading == Fading.NAKAGAMI && !given(nakagamiM)) {
                throw new IllegalArgumentException("--fading nakagami needs --nakagami-m (m >= 0.5)");
            }
        }
        if (given(kFactor) && fading != Fading.RICIAN) {
            throw new IllegalArgumentException("--k-factor applies only to --fading rician");
        }
        if (given(nakagamiM) && fading != Fading.NAKAGAMI) {
            throw new IllegalArgumentException("--nakagami-m applies only to --fading nakagami");
        }
        boolean scattered = fading == Fading.RAYLEIGH || fading == Fading.RICIAN;
        for (String option : new String[] {"--tx-corr", "--rx-corr", "--doppler"}) {
            double value = option.equals("--tx-corr") ? txCorr : option.equals("--rx-corr") ? rxCorr : doppler;
            if (given(value) && !scattered) {
                throw new IllegalArgumentException(option + " applies only to --fading rayleigh or rician");
            }
        }
        if (correlation != null) {
            if (given(txCorr) || given(rxCorr)) {
                throw new IllegalArgumentException("--tx-corr and --rx-corr cannot be combined with correlation matrices");
            }
            if (!scattered) {
                throw new IllegalArgumentException("correlation matrices apply only to --fading rayleigh or rician");
            }
            if (correlation.nr() != nr || correlation.mt() != mt) {
                throw new IllegalArgumentException("correlation matrices are for Nr x Mt = " + correlation.nr()
                        + " x " + correlation.mt() + " but the link has " + nr + " x " + mt);
            }
        }
        if (given(csiError) && pilots > 0) {
            throw new IllegalArgumentException("--csi-error and --pilots cannot be combined");
        }
        if (pilots > 0 && pilots < mt) {
            throw new IllegalArgumentException("--pilots must be at least the number of transmit antennas Mt = " + mt
                    + " (orthogonal pilots), got " + pilots);
        }
    }

    /**
     * A fading model drawing one matrix per call with these options, for block-level uses such as
     * outage: Doppler and CSI do not apply (a block's first matrix has the same distribution with or
     * without Doppler); a trace is handed out in order (see {@link TraceFading}). One per thread.
     */
    public FadingModel newModel(int nr, int mt) {
        check(nr, mt);
        if (trace != null) {
            return new TraceFading(trace);
        }
        KroneckerCorrelation c = correlation(nr, mt);
        switch (fading) {
            case RAYLEIGH:
                return c == null ? new RayleighFading() : new RayleighFading(c);
            case RICIAN:
                return c == null ? new RicianFading(kFactor) : new RicianFading(kFactor, c);
            case NAKAGAMI:
                return new NakagamiFading(nakagamiM);
            case NONE:
                return new NoFading();
            default:
                throw new AssertionError(fading);
        }
    }

    /**
     * The channel of one link (one per thread): fading blocks of at most {@code maxSlotsPerBlock}
     * slots, each with its CSI.
     */
    public LinkChannel newLinkChannel(int nr, int mt, int maxSlotsPerBlock) {
        check(nr, mt);
        if (maxSlotsPerBlock < 1) {
            throw new IllegalArgumentException("slots per fading block must be >= 1, got " + maxSlotsPerBlock);
        }
        CsiEstimator csi = pilots > 0 ? CsiEstimator.leastSquares(nr, mt, pilots)
                : given(csiError) ? CsiEstimator.withError(nr, mt, csiError) : CsiEstimator.perfect(nr, mt);
        if (varies()) {
            double k = fading == Fading.RICIAN ? kFactor : 0.0;
            DopplerFading process = new DopplerFading(nr, mt, doppler, k, correlation(nr, mt));
            return new LinkChannel(nr, mt, maxSlotsPerBlock, null, null, process, csi);
        }
        if (trace != null) {
            return new LinkChannel(nr, mt, maxSlotsPerBlock, null, trace, null, csi);
        }
        return new LinkChannel(nr, mt, maxSlotsPerBlock, newModel(nr, mt), null, null, csi);
    }

    /** Nakagami m, or NaN when not given. */
    public double nakagamiM() {
        return nakagamiM;
    }

    /** True when the receiver decodes with a channel error of fixed variance ({@code --csi-error}). */
    public boolean fixedCsiError() {
        return given(csiError) && csiError > 0;
    }

    /** True when full correlation matrices (which may be singular) are given. */
    public boolean correlationMatrices() {
        return correlation != null;
    }

    /**
     * Whether the channel is i.i.d. Rayleigh block fading (whatever the receiver's CSI): the channel
     * for which the outage bounds have closed forms.
     */
    public boolean iidRayleigh() {
        return trace == null && fading == Fading.RAYLEIGH && !given(txCorr) && !given(rxCorr) && correlation == null
                && !given(doppler);
    }

    /** A short label, e.g. {@code rician K=3, rx-corr 0.5, doppler 0.01, pilots 4}. */
    public String describe() {
        StringBuilder sb = new StringBuilder();
        if (trace != null) {
            sb.append("trace ").append(trace.source()).append(" (").append(trace.size()).append(" matrices)");
        } else {
            sb.append(fading.cliName());
            if (given(kFactor)) {
                sb.append(" K=").append(kFactor);
            }
            if (given(nakagamiM)) {
                sb.append(" m=").append(nakagamiM);
            }
        }
        if (given(txCorr)) {
            sb.append(", tx-corr ").append(txCorr);
        }
        if (given(rxCorr)) {
            sb.append(", rx-corr ").append(rxCorr);
        }
        if (correlation != null) {
            sb.append(", correlation matrices");
        }
        if (given(doppler)) {
            sb.append(", doppler ").append(doppler);
        }
        if (given(csiError)) {
            sb.append(", csi-error ").append(csiError);
        }
        if (pilots > 0) {
            sb.append(", pilots ").append(pilots);
        }
        return sb.toString();
    }

    @Override
    public String toString() {
        return describe();
    }

    /** The correlation for the link, or null when there is none. */
    private KroneckerCorrelation correlation(int nr, int mt) {
        if (correlation != null) {
            return correlation.copy();
        }
        double rx = given(rxCorr) ? rxCorr : 0.0;
        double tx = given(txCorr) ? txCorr : 0.0;
        return rx == 0.0 && tx == 0.0 ? null : KroneckerCorrelation.exponential(nr, mt, rx, tx);
    }

    /** {@code value} if finite and at least {@code min}, else an error "{@code rule}, got value". */
    private static double atLeast(String rule, double min, double value) {
        if (!(value >= min && value < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException(rule + ", got " + value);
        }
        return value;
    }

    private static double coefficient(String option, double r) {
        if (!(r > -1.0 && r < 1.0)) {
            throw new IllegalArgumentException(option + " must be an exponential correlation coefficient in (-1, 1), got "
                    + r);
        }
        return r;
    }

    private static boolean given(double value) {
        return !Double.isNaN(value);
    }
}

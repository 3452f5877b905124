package org.fadebench.channel;

import java.io.Serializable;

/**
 * Everything the command line says about the channel: the fading model by name with the settings
 * given for it, or a recorded trace, and the receiver's CSI. Immutable: each {@code with…} returns a
 * changed copy and checks its own value; {@link #model} resolves the name and settings through
 * {@link ChannelModels} into a {@link ChannelModel}, which checks the combination, and {@link #check}
 * checks all of it for a link of Nr x Mt antennas. Messages start with the setting they are about.
 *
 * <p>Option ↔ method: {@code --fading} {@link #of(String)}, {@code --k-factor} {@link #withKFactor},
 * {@code --nakagami-m} {@link #withNakagamiM}, {@code --tx-corr} {@link #withTxCorr},
 * {@code --rx-corr} {@link #withRxCorr}, {@code --doppler} {@link #withDoppler},
 * {@code --csi-error} {@link #withCsiError}, {@code --pilots} {@link #withPilots},
 * {@code --trace} {@link #withTrace}.
 */
public final class ChannelSpec implements Serializable {

    private final ChannelModels registry;
    /** The name the model is looked up by, or the name of {@link #given}. */
    private final String name;
    /** A model given as a value (library use), or null to look {@link #name} up. */
    private final ChannelModel given;
    private final ModelOptions options;
    private final ChannelTrace trace;
    /** The CSI error variance, or null for none. */
    private final Double csiError;
    /** Pilot slots per fading block, 0 for none. */
    private final int pilots;

    private ChannelSpec(ChannelModels registry, String name, ChannelModel given, ModelOptions options,
                        ChannelTrace trace, Double csiError, int pilots) {
        this.registry = registry;
        this.name = name;
        this.given = given;
        this.options = options;
        this.trace = trace;
        this.csiError = csiError;
        this.pilots = pilots;
    }

    /** A channel of the given built-in fading kind, block fading, perfect CSI. */
    public static ChannelSpec of(Fading fading) {
        if (fading == null) {
            throw new IllegalArgumentException("--fading must be one of " + ChannelModels.STANDARD.choices());
        }
        return of(fading.cliName());
    }

    /**
     * The model {@code name} of {@link ChannelModels#STANDARD}, block fading, perfect CSI.
     *
     * @throws IllegalArgumentException for an unknown name, listing the valid ones
     */
    public static ChannelSpec of(String name) {
        return of(ChannelModels.STANDARD, name);
    }

    /** The model {@code name} of {@code registry}, block fading, perfect CSI. */
    public static ChannelSpec of(ChannelModels registry, String name) {
        if (!registry.has(name)) {
            throw new IllegalArgumentException("unknown fading model '" + name + "'; valid: " + registry.choices());
        }
        return new ChannelSpec(registry, name.trim().toLowerCase(java.util.Locale.ROOT), null, ModelOptions.NONE,
                null, null, 0);
    }

    /** A model given as a value (its settings are its own), perfect CSI. */
    public static ChannelSpec of(ChannelModel model) {
        return new ChannelSpec(null, model.name(), java.util.Objects.requireNonNull(model, "model"),
                ModelOptions.NONE, null, null, 0);
    }

    /**
     * This channel with the model setting {@code key} (e.g. {@code --k-factor}) given as
     * {@code value}: for a model's own settings; the model checks the value when it is built. The
     * {@code with…} methods below are this for the built-in settings, with the value checked at once.
     */
    public ChannelSpec withSetting(String key, Object value) {
        return new ChannelSpec(registry, name, given, options.with(key, value), trace, csiError, pilots);
    }

    /** Rician line-of-sight factor K (linear), finite and ≥ 0; needs {@code --fading rician}. */
    public ChannelSpec withKFactor(double k) {
        return withSetting(ModelOptions.K_FACTOR, RicianChannel.checkKFactor(k));
    }

    /** Nakagami m, finite and ≥ 0.5; needs {@code --fading nakagami}. */
    public ChannelSpec withNakagamiM(double m) {
        return withSetting(ModelOptions.NAKAGAMI_M, NakagamiChannel.checkM(m));
    }

    /** Exponential correlation coefficient r in (−1, 1) between neighbouring transmit antennas. */
    public ChannelSpec withTxCorr(double r) {
        return withSetting(ModelOptions.TX_CORR, SpatialCorrelation.coefficient(ModelOptions.TX_CORR, r));
    }

    /** Exponential correlation coefficient r in (−1, 1) between neighbouring receive antennas. */
    public ChannelSpec withRxCorr(double r) {
        return withSetting(ModelOptions.RX_CORR, SpatialCorrelation.coefficient(ModelOptions.RX_CORR, r));
    }

    /** Full correlation matrices (for library use; the CLI has the exponential profiles). */
    public ChannelSpec withCorrelation(KroneckerCorrelation correlation) {
        return withSetting(ModelOptions.CORRELATION_MATRICES, java.util.Objects.requireNonNull(correlation));
    }

    /** Normalised Doppler f_D·T_s in [0, 0.5]; above 0 the channel changes every slot. */
    public ChannelSpec withDoppler(double normalisedDoppler) {
        return withSetting(ModelOptions.DOPPLER, DopplerChannel.checkDoppler(normalisedDoppler));
    }

    /** CSI error variance σ² per entry (Ĥ = H + CN(0, σ²)), finite and ≥ 0. */
    public ChannelSpec withCsiError(double variance) {
        return new ChannelSpec(registry, name, given, options, trace, CsiEstimator.checkErrorVariance(variance),
                pilots);
    }

    /** Least-squares CSI from this many pilot slots per fading block, 1 to {@value CsiEstimator#MAX_PILOTS} (and ≥ Mt). */
    public ChannelSpec withPilots(int count) {
        if (count < 1 || count > CsiEstimator.MAX_PILOTS) {
            throw new IllegalArgumentException("--pilots must be 1 to " + CsiEstimator.MAX_PILOTS + " (and at least Mt), got "
                    + count);
        }
        return new ChannelSpec(registry, name, given, options, trace, csiError, count);
    }

    /** Channel matrices from a recorded trace instead of a fading model (read it with {@link ChannelTrace#read}). */
    public ChannelSpec withTrace(ChannelTrace trace) {
        return new ChannelSpec(registry, name, given, options, trace, csiError, pilots);
    }

    /** The fading model's name (with a trace: the name given, which the trace replaces). */
    public String modelName() {
        return name;
    }

    /** The trace, or null. */
    public ChannelTrace trace() {
        return trace;
    }

    /**
     * The channel model: the trace, the model given as a value, or the named model built from the
     * settings given.
     *
     * @throws IllegalArgumentException naming the setting and what is wrong
     */
    public ChannelModel model() {
        if (trace != null) {
            if (!options.keys().isEmpty()) {
                throw new IllegalArgumentException("--trace takes the channel from the file and cannot be combined with "
                        + options.keys().iterator().next());
            }
            return new TraceChannel(trace);
        }
        if (given != null) {
            if (!options.keys().isEmpty()) {
                throw new IllegalArgumentException(options.keys().iterator().next() + " cannot be combined with a "
                        + "model given as a value");
            }
            return given;
        }
        return registry.create(name, options);
    }

    /** Whether the channel changes from slot to slot (Doppler above 0). */
    public boolean varies() {
        return model().varies();
    }

    /** Pilot slots per fading block (0 without {@code --pilots}). */
    public int pilots() {
        return pilots;
    }

    /**
     * The share of slots spent on pilots in a frame of {@code dataSlots} data slots over
     * {@code fadingBlocks} fading blocks, N·B/(N·B + data slots) for N pilot slots per block; 0 without
     * pilots. Pilots are not charged to the SNR: report this beside the spectral efficiency (the net
     * value is the nominal one times 1 − overhead).
     */
    public double pilotOverhead(int dataSlots, int fadingBlocks) {
        if (dataSlots < 1 || fadingBlocks < 1) {
            throw new IllegalArgumentException("data slots and fading blocks must be >= 1, got " + dataSlots + " and "
                    + fadingBlocks);
        }
        double pilotSlots = (double) pilots * fadingBlocks;
        return pilots == 0 ? 0.0 : pilotSlots / (pilotSlots + dataSlots);
    }

    /**
     * Checks the combination of options for a link of {@code nr} receive and {@code mt} transmit
     * antennas.
     *
     * @throws IllegalArgumentException naming the option and what is wrong
     */
    public void check(int nr, int mt) {
        model(nr, mt);
    }

    /** The {@linkplain #model() model}, checked with the CSI for a link of {@code nr} x {@code mt} antennas. */
    public ChannelModel model(int nr, int mt) {
        Antennas.check(nr, mt);
        ChannelModel model = model();
        model.check(nr, mt);
        if (csiError != null && pilots > 0) {
            throw new IllegalArgumentException("--csi-error and --pilots cannot be combined");
        }
        if (pilots > 0 && pilots < mt) {
            throw new IllegalArgumentException("--pilots must be at least the number of transmit antennas Mt = " + mt
                    + " (orthogonal pilots), got " + pilots);
        }
        return model;
    }

    /**
     * A fading model drawing one matrix per call with these options, for block-level uses such as
     * outage: Doppler and CSI do not apply (a block's first matrix has the same distribution with or
     * without Doppler); a trace is handed out in order (see {@link TraceFading}). One per thread.
     */
    public FadingModel newModel(int nr, int mt) {
        return model(nr, mt).newModel(nr, mt);
    }

    /**
     * The channel of one link (one per thread): fading blocks of at most {@code maxSlotsPerBlock}
     * slots, each with its CSI.
     */
    public LinkChannel newLinkChannel(int nr, int mt, int maxSlotsPerBlock) {
        ChannelModel model = model(nr, mt);
        if (maxSlotsPerBlock < 1) {
            throw new IllegalArgumentException("slots per fading block must be >= 1, got " + maxSlotsPerBlock);
        }
        CsiEstimator csi = pilots > 0 ? CsiEstimator.leastSquares(nr, mt, pilots)
                : csiError != null ? CsiEstimator.withError(nr, mt, csiError) : CsiEstimator.perfect(nr, mt);
        return new LinkChannel(nr, mt, maxSlotsPerBlock, model.newBlockChannel(nr, mt), csi, model);
    }

    /** True when the receiver decodes with a channel error of fixed variance ({@code --csi-error}). */
    public boolean fixedCsiError() {
        return csiError != null && csiError > 0;
    }

    /**
     * Whether the channel is i.i.d. Rayleigh block fading (whatever the receiver's CSI): the channel
     * for which the outage bounds have closed forms.
     */
    public boolean iidRayleigh() {
        return model().iidRayleigh();
    }

    /**
     * Whether the channel is plain AWGN: the model {@code none} (h = 1 on every antenna pair, see
     * {@link AwgnChannel}), not a trace (whatever the receiver's CSI).
     */
    public boolean awgn() {
        return trace == null && model() instanceof AwgnChannel;
    }

    /**
     * A short label naming the model with its parameters and the receiver's CSI, e.g.
     * {@code rician K=3.0, rx-corr 0.5, doppler 0.01, pilots 4} or {@code rayleigh, perfect CSI}.
     */
    public String describe() {
        return model().describe() + (csiError != null ? ", csi-error " + csiError : "")
                + (pilots > 0 ? ", pilots " + pilots : "") + (csiError == null && pilots == 0 ? ", perfect CSI" : "");
    }

    @Override
    public String toString() {
        return describe();
    }
}

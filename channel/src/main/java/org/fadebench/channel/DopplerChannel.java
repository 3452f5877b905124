package org.fadebench.channel;

/**
 * A Rayleigh or Rician channel that ages within a fading block with normalised Doppler f_D·T_s in
 * [0, 0.5] (see {@link DopplerFading}). At 0 the channel is constant over a block (the scattered
 * model's own draws), though still labelled with its Doppler.
 *
 * @param scattered         the model whose scattered part ages: K-factor and correlation
 * @param normalisedDoppler f_D·T_s
 */
public record DopplerChannel(ScatteredChannel scattered, double normalisedDoppler) implements ChannelModel {

    public DopplerChannel {
        java.util.Objects.requireNonNull(scattered, "scattered");
        checkDoppler(normalisedDoppler);
    }

    /** {@code fd} if it is a normalised Doppler in [0, 0.5], else an error naming {@code --doppler}. */
    public static double checkDoppler(double fd) {
        if (!(fd >= 0.0 && fd <= 0.5)) {
            throw new IllegalArgumentException("--doppler must be a normalised Doppler f_D·T_s in [0, 0.5], got " + fd);
        }
        return fd;
    }

    /** {@code scattered} with the {@link ModelOptions#DOPPLER} of {@code options}, if one was given. */
    static ChannelModel over(ScatteredChannel scattered, ModelOptions options) {
        Double fd = options.number(ModelOptions.DOPPLER);
        return fd == null ? scattered : new DopplerChannel(scattered, fd);
    }

    @Override
    public String name() {
        return scattered.name();
    }

    @Override
    public void check(int nr, int mt) {
        scattered.check(nr, mt);
    }

    /** The scattered model's: a block's first matrix has the same distribution with or without Doppler. */
    @Override
    public FadingModel newModel(int nr, int mt) {
        return scattered.newModel(nr, mt);
    }

    @Override
    public BlockChannel newBlockChannel(int nr, int mt) {
        if (!varies()) {
            return scattered.newBlockChannel(nr, mt);
        }
        DopplerFading process = new DopplerFading(nr, mt, normalisedDoppler, scattered.kFactor(),
                scattered.correlation().forLink(nr, mt));
        return new BlockChannel() {
            @Override
            public void startBlock(Draws draws, long blockIndex, int slots, double[] h) {
                process.drawBlock(draws, slots, h);
            }

            @Override
            public boolean varies() {
                return true;
            }
        };
    }

    @Override
    public boolean varies() {
        return normalisedDoppler > 0.0;
    }

    @Override
    public String describe() {
        return scattered.describe() + ", doppler " + normalisedDoppler;
    }
}

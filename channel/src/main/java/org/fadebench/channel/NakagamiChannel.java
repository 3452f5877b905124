package org.fadebench.channel;

/** Nakagami-m block fading with independent entries, m ≥ 0.5 (see {@link NakagamiFading}). */
public record NakagamiChannel(double m) implements ChannelModel {

    public NakagamiChannel {
        checkM(m);
    }

    /** {@code m} if it is a finite Nakagami m ≥ 0.5, else an error naming {@code --nakagami-m}. */
    public static double checkM(double m) {
        if (!(m >= 0.5 && m < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("--nakagami-m must be a finite Nakagami m >= 0.5, got " + m);
        }
        return m;
    }

    @Override
    public String name() {
        return "nakagami";
    }

    @Override
    public FadingModel newModel(int nr, int mt) {
        return new NakagamiFading(m);
    }

    @Override
    public double fadeShape() {
        return m;
    }

    @Override
    public String describe() {
        return name() + " m=" + m;
    }

    /** m: ‖h‖² of one pair is Gamma(m), so Mt·Nr pairs give Gamma(m·Mt·Nr) (common practice, no source). */
    @Override
    public double diversityPerPair() {
        return m;
    }
}

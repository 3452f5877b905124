package org.fadebench.channel;

/** No fading: every entry of H is 1, a pure AWGN link (see {@link NoFading}). */
public record AwgnChannel() implements ChannelModel {

    @Override
    public String name() {
        return "none";
    }

    @Override
    public FadingModel newModel(int nr, int mt) {
        return new NoFading();
    }

    @Override
    public String describe() {
        return "AWGN (no fading, h = 1)";
    }
}

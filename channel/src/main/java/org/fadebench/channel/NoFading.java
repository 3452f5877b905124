package org.fadebench.channel;

import java.util.Arrays;

/** No fading: every entry of H is 1, so the link is a pure AWGN link. */
public final class NoFading implements FadingModel {

    @Override
    public void draw(Draws draws, int nr, int mt, double[] h) {
        int n = nr * mt;
        for (int i = 0; i < n; i++) {
            h[2 * i] = 1.0;
            h[2 * i + 1] = 0.0;
        }
        Arrays.fill(h, 2 * n, h.length, 0.0);
    }

    @Override
    public String name() {
        return "none";
    }
}

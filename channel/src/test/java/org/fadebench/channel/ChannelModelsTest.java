package org.fadebench.channel;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.function.Supplier;
import org.junit.jupiter.api.Test;

/** The channel-model values check their own parameters, and a value is the same channel as its name and settings. */
class ChannelModelsTest {

    @Test
    void valuesCheckTheirParametersNamingTheSetting() {
        assertMessage("--k-factor must be a finite linear K-factor >= 0, got -1.0",
                () -> new RicianChannel(-1, SpatialCorrelation.NONE));
        assertMessage("--nakagami-m must be a finite Nakagami m >= 0.5, got 0.4", () -> new NakagamiChannel(0.4));
        assertMessage("--doppler must be a normalised Doppler f_D·T_s in [0, 0.5], got 0.6",
                () -> new DopplerChannel(new RayleighChannel(), 0.6));
        assertMessage("--rx-corr must be an exponential correlation coefficient in (-1, 1), got 1.0",
                () -> new SpatialCorrelation(1.0, null, null));
        assertMessage("--tx-corr and --rx-corr cannot be combined with correlation matrices",
                () -> new SpatialCorrelation(null, 0.2, KroneckerCorrelation.identity(2, 2)));
        assertMessage("correlation matrices are for Nr x Mt = 2 x 2 but the link has 2 x 3", () -> {
            new RayleighChannel(new SpatialCorrelation(null, null, KroneckerCorrelation.identity(2, 2))).check(2, 3);
            return null;
        });
        assertMessage("antenna counts must be in 1..64, got Mt = 65, Nr = 2", () -> {
            Antennas.check(2, 65);
            return null;
        });
    }

    /** The value and the spec built from its name and settings draw the same channels from the same stream. */
    @Test
    void aValueIsTheChannelOfItsNameAndSettings() {
        ChannelModel value = new DopplerChannel(new RicianChannel(2, new SpatialCorrelation(0.5, null, null)), 0.02);
        ChannelSpec named = ChannelSpec.of("rician").withKFactor(2).withRxCorr(0.5).withDoppler(0.02);
        assertEquals(value, named.model());
        assertEquals(named.describe(), ChannelSpec.of(value).describe());
        assertArrayEquals(block(named, 5), block(ChannelSpec.of(value), 5), 0.0);
        assertTrue(value.varies());
    }

    /** Doppler 0 is given but keeps the channel constant over a block: the scattered model's own draws. */
    @Test
    void dopplerZeroDoesNotVary() {
        ChannelSpec still = ChannelSpec.of("rayleigh").withDoppler(0);
        assertFalse(still.varies());
        assertFalse(still.iidRayleigh(), "a Doppler given is not the closed-form channel");
        assertTrue(ChannelSpec.of("rayleigh").iidRayleigh());
        assertFalse(ChannelSpec.of("rayleigh").withTxCorr(0).iidRayleigh(), "a correlation given as 0 is given");
        assertArrayEquals(block(ChannelSpec.of("rayleigh"), 1), block(still, 1), 0.0);
    }

    /** The first 2x2 matrices of a block of {@code slots} slots, drawn from a fixed stream. */
    private static double[] block(ChannelSpec spec, int slots) {
        LinkChannel channel = spec.newLinkChannel(2, 2, slots);
        channel.startBlock(Draws.of(7, 1), 0, slots);
        double[] h = new double[8 * slots];
        double[] one = new double[8];
        for (int s = 0; s < slots; s++) {
            channel.trueChannel(s, one);
            System.arraycopy(one, 0, h, 8 * s, 8);
        }
        return h;
    }

    private static void assertMessage(String expected, Supplier<?> action) {
        assertEquals(expected, assertThrows(IllegalArgumentException.class, action::get).getMessage());
    }
}

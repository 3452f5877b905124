package org.fadebench.bench.link;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Set;
import org.apache.commons.statistics.distribution.NormalDistribution;
import org.fadebench.bench.sweep.StopRules;
import org.fadebench.bench.sweep.SweepEngine;
import org.fadebench.channel.ChannelModel;
import org.fadebench.channel.ChannelModels;
import org.fadebench.channel.ChannelSpec;
import org.fadebench.channel.FadingModel;
import org.fadebench.coding.stbc.Equaliser;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.Modulation;
import org.junit.jupiter.api.Test;

/**
 * The contributor guide's recipe "a channel model", followed in a test: a model that exists only
 * here (its own record, one registry entry) runs through the whole link with no other change.
 */
class ChannelModelRecipeTest {

    /** The model's one setting. */
    private static final String PHASE = "--phase";

    /**
     * Step 1, the model's own class: every entry of H is e^{j·phase} (a fixed rotation, no fading),
     * with its parameter checked on construction and the setting named in the message.
     */
    record RotatedChannel(double phase) implements ChannelModel {

        RotatedChannel {
            if (!(phase >= 0 && phase < 2 * Math.PI)) {
                throw new IllegalArgumentException(PHASE + " must be an angle in [0, 2π) radians, got " + phase);
            }
        }

        @Override
        public String name() {
            return "rotated";
        }

        @Override
        public String describe() {
            return name() + " phase " + phase;
        }

        @Override
        public FadingModel newModel(int nr, int mt) {
            double re = Math.cos(phase);
            double im = Math.sin(phase);
            return new FadingModel() {
                @Override
                public void draw(org.fadebench.channel.Draws draws, int rows, int cols, double[] h) {
                    for (int i = 0; i < rows * cols; i++) {
                        h[2 * i] = re;
                        h[2 * i + 1] = im;
                    }
                }

                @Override
                public String name() {
                    return "rotated";
                }
            };
        }
    }

    /** Step 2, the registry: its name, the settings it takes and its factory. */
    private static final ChannelModels MODELS = ChannelModels.STANDARD.with("rotated", Set.of(PHASE),
            o -> new RotatedChannel(o.required("rotated", PHASE, "radians")));

    /**
     * Step 3, its tests. With perfect CSI a rotation is undone by the combiner, so 1x2 BPSK over it
     * is the AWGN link with MRC gain 2: BER = Q(√(2·2·SNR)) (J. G. Proakis and M. Salehi, Digital
     * Communications, 5th ed., 2008, Sec. 4.2). Tolerance: 4.5 binomial standard errors.
     */
    @Test
    void aModelKnownOnlyToItsRegistryRunsThroughTheLink() {
        ChannelSpec channel = ChannelSpec.of(MODELS, "rotated").withSetting(PHASE, 1.0);
        LinkSettings link = new LinkSettings(Modulation.BPSK, SpaceTimeCodes.NONE, 2, 1, channel, 512, 0, Equaliser.MF,
                FrameCoding.NONE);
        assertEquals("rotated", link.fading());
        assertTrue(link.describe().contains("rotated phase 1.0"), link.describe());
        double snrDb = 1;
        FrameCounters c = new SweepEngine(link, new StopRules(0, 300, 0, 0), 3, 2, 0.95)
                .run(new double[] {snrDb}, p -> { }).results().get(0).counts();
        double ber = NormalDistribution.of(0, 1).survivalProbability(Math.sqrt(4 * Math.pow(10, snrDb / 10)));
        assertTrue(c.bitErrors() >= 100, "too few errors");
        assertEquals(ber, c.ber(), 4.5 * Math.sqrt(ber * (1 - ber) / c.bits()));
    }

    /** The registry names the model's setting in every message, as for the built-in models. */
    @Test
    void theRegistryChecksTheModelsSetting() {
        assertMessage("--phase must be an angle in [0, 2π) radians, got 7.0",
                ChannelSpec.of(MODELS, "rotated").withSetting(PHASE, 7.0));
        assertMessage("--fading rotated needs --phase (radians)", ChannelSpec.of(MODELS, "rotated"));
        assertMessage("--phase applies only to --fading rotated",
                ChannelSpec.of(MODELS, "rayleigh").withSetting(PHASE, 1.0));
        assertMessage("--k-factor applies only to --fading rician",
                ChannelSpec.of(MODELS, "rotated").withSetting(PHASE, 1.0).withKFactor(2));
        assertEquals("rayleigh, rician, nakagami, none, rotated", MODELS.choices());
        assertFalse(ChannelModels.STANDARD.has("rotated"), "the standard registry is not changed");
    }

    private static void assertMessage(String expected, ChannelSpec spec) {
        assertEquals(expected, assertThrows(IllegalArgumentException.class, () -> spec.check(2, 1)).getMessage());
    }
}

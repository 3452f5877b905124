package org.fadebench.bench.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Optional;
import org.fadebench.bench.link.FrameCoding;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.channel.ChannelSpec;
import org.fadebench.coding.stbc.Equaliser;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.Modulation;
import org.junit.jupiter.api.Test;

class CsiAgeingTest {

    /**
     * J0 by its power series J0(x) = Σ_k (−1)^k (x/2)^(2k) / (k!)² (M. Abramowitz and I. A. Stegun,
     * Handbook of Mathematical Functions, 1964, eq. 9.1.10), independent of Commons Math's BesselJ.
     */
    private static double j0Series(double x) {
        double term = 1.0;
        double sum = 1.0;
        for (int k = 1; k < 60; k++) {
            term *= -(x / 2) * (x / 2) / ((double) k * k);
            sum += term;
        }
        return sum;
    }

    /** x½ solves J0(x) = 1/2 and is the first such x: J0 falls from 1 to 1/2 on (0, x½). */
    @Test
    void halfCorrelationArgument() {
        double x = CsiAgeing.HALF_CORRELATION_ARGUMENT;
        assertEquals(0.5, j0Series(x), 1e-10);
        for (double t = 0.01; t < x; t += 0.01) {
            assertTrue(j0Series(t) > 0.5, "J0(" + t + ")");
        }
        assertEquals(j0Series(2 * Math.PI * 0.01 * 25), CsiAgeing.correlation(0.01, 25), 1e-12);
    }

    private static LinkSettings alamouti(double doppler, int coherence) {
        ChannelSpec channel = ChannelSpec.of(org.fadebench.channel.Fading.RAYLEIGH);
        if (doppler > 0) {
            channel = channel.withDoppler(doppler);
        }
        return new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 1, 2, channel, 1024, coherence, Equaliser.MF,
                FrameCoding.NONE);
    }

    /**
     * f_D = 0.01: the longest block whose last slot keeps ρ ≥ 1/2 has L − 1 ≤ 1.5211/(2π·0.01) = 24.2
     * slots, so L ≤ 25, and 24 for Alamouti's 2-slot blocks. The default block (the whole 512-slot frame)
     * is warned about with that advice; 24 slots pass, 26 slots (ρ(25) = J0(1.571) ≈ 0.47) do not.
     */
    @Test
    void warnsWhenTheBlockOutlivesTheCsi() {
        Optional<String> whole = CsiAgeing.warning(alamouti(0.01, 0));
        assertTrue(whole.isPresent());
        assertTrue(whole.get().startsWith("--doppler 0.01 changes the channel so much within each fading block of 512"
                + " slots that the receiver's CSI"), whole.get());
        assertTrue(whole.get().contains("use --coherence 24 or less"), whole.get());
        assertEquals(Optional.empty(), CsiAgeing.warning(alamouti(0.01, 24)));
        assertTrue(CsiAgeing.warning(alamouti(0.01, 26)).isPresent());
        assertEquals(Optional.empty(), CsiAgeing.warning(alamouti(0, 0)), "block fading");
        assertTrue(CsiAgeing.warning(alamouti(0.4, 2)).get().contains("even one code block of 2 slots is too long"));
    }
}

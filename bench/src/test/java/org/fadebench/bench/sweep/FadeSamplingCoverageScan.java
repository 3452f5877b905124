package org.fadebench.bench.sweep;

import org.fadebench.bench.link.LinkSettings;
import org.fadebench.channel.Fading;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.Modulation;

/**
 * Not a test (too slow for the suite): the coverage scan behind the README's Rare events limits and
 * {@link FadeSamplingTest}'s comments. Runs one fade-sampling point per seed in this JVM, uncoded
 * QPSK 256-bit quasi-static frames at the closed form's FER, and prints how often the 95 % interval
 * covers the closed form. Arguments: {@code none|alamouti rx fer firstSeed seeds relPrecision
 * maxFrames}, e.g. {@code alamouti 2 1e-7 1000 200 0.2 4000000} (the test classpath; wrap it in the
 * measurement lock on a shared machine).
 */
public final class FadeSamplingCoverageScan {

    private FadeSamplingCoverageScan() {
    }

    public static void main(String[] args) {
        SpaceTimeCode code = SpaceTimeCodes.byName(args[0]);
        int rx = Integer.parseInt(args[1]);
        LinkSettings link = new LinkSettings(Modulation.QPSK, code, rx, code.transmitAntennas(), Fading.RAYLEIGH, 256,
                0);
        double snrDb = FadeSamplingTest.snrDbAt(link, Double.parseDouble(args[2]));
        double theory = FadeSamplingTest.closedFormFer(link, snrDb);
        long first = Long.parseLong(args[3]);
        int seeds = Integer.parseInt(args[4]);
        int covered = 0;
        int below = 0;
        double frames = 0;
        double ratio = 0;
        for (int i = 0; i < seeds; i++) {
            PointResult r = FadeSamplingTest.fadeSampled(link, snrDb, first + i, Long.parseLong(args[6]),
                    Double.parseDouble(args[5]));
            covered += r.ferLow() <= theory && theory <= r.ferHigh() ? 1 : 0;
            below += r.ferHigh() < theory ? 1 : 0;
            frames += r.counts().frames();
            ratio += r.counts().fer() / theory;
        }
        System.out.printf("%s at %.4f dB (closed form %.4g): covered %d of %d, below %d, above %d; mean weighted "
                + "frames %.0f, mean estimate / closed form %.3f%n", link.describe(), snrDb, theory, covered, seeds, below,
                seeds - covered - below, frames / seeds, ratio / seeds);
    }
}

package org.fadebench.coding.fec;

/**
 * No channel code ({@code none}): the information bits are sent as they are and decided from the
 * sign of their LLRs. Decisions are per bit, so nothing is gained by decoding frames together:
 * one lane.
 */
final class Uncoded implements ChannelCode {

    private static final long serialVersionUID = 1L;

    @Override
    public String cliName() {
        return "none";
    }

    @Override
    public double rate() {
        return 1.0;
    }

    @Override
    public int codedBits(int infoBits) {
        return infoBits;
    }

    @Override
    public long bytesPerLane(int infoBits) {
        return infoBits;
    }

    @Override
    public long coderBytes(int infoBits, int lanes) {
        return lanes * Lanes.rowBytes(infoBits);
    }

    @Override
    public int lanes(int infoBits) {
        return 1;
    }

    @Override
    public LaneCoder newCoder(int infoBits, int lanes) {
        return new HardDecisions(infoBits, lanes);
    }

    @Override
    public String toString() {
        return cliName();
    }

    /** One instance: links compare their code with {@link ChannelCodes#NONE}. */
    private Object readResolve() {
        return ChannelCodes.NONE;
    }

    /** Each lane keeps the hard decisions of its frame. */
    private static final class HardDecisions implements LaneCoder {

        private final int bits;
        private final byte[][] hard;
        private int decodedLanes;

        HardDecisions(int bits, int lanes) {
            if (bits < 1 || lanes < 1) {
                throw new IllegalArgumentException(bits + " bits in " + lanes + " lanes; need at least 1 of each");
            }
            this.bits = bits;
            this.hard = new byte[lanes][bits];
        }

        @Override
        public void encode(byte[] info, int off, byte[] coded, int codedOff) {
            System.arraycopy(info, off, coded, codedOff, bits);
        }

        @Override
        public void load(int lane, double[] llr, int off) {
            Lanes.checkLane(lane, hard.length);
            byte[] row = hard[lane];
            for (int i = 0; i < bits; i++) {
                row[i] = (byte) (llr[off + i] < 0 ? 1 : 0);
            }
        }

        @Override
        public void decode(int frames) {
            Lanes.checkFrames(frames, hard.length);
            decodedLanes = frames;
        }

        @Override
        public void decided(int lane, byte[] info, int off) {
            Lanes.checkLane(lane, decodedLanes);
            System.arraycopy(hard[lane], 0, info, off, bits);
        }
    }
}

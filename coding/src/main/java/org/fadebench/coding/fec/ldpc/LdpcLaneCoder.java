package org.fadebench.coding.fec.ldpc;

import org.fadebench.coding.fec.LaneCoder;
import org.fadebench.coding.fec.Lanes;

/**
 * The {@link LaneCoder} of an {@link LdpcCode} at one information size: encodes with the layout's
 * encoder and sends the sent columns in order; loads a frame's LLRs into their columns of H (the
 * punctured columns stay at 0) and hands them to the lane decoder; the decided bits are the hard
 * decisions on the information columns. Allocates only in its constructor; not thread-safe.
 */
final class LdpcLaneCoder implements LaneCoder {

    private final LdpcEncoder encoder;
    private final LdpcDecoder decoder;
    private final int[] infoColumns;
    /**
     * The sent columns as runs of consecutive columns sent one after the other (a layout sends its
     * columns in order, leaving out the punctured ones): run r is {@code runLength[r]} columns from
     * {@code runColumn[r]}, sent from bit {@code runSent[r]}.
     */
    private final int[] runColumn;
    private final int[] runSent;
    private final int[] runLength;
    /** The codeword, in H's column order. */
    private final byte[] word;
    /** A frame's LLRs in H's column order; punctured columns are never written and stay 0. */
    private final double[] columnLlr;
    private int decodedLanes;

    LdpcLaneCoder(CodeLayout layout, LdpcDecoder decoder) {
        this.encoder = layout.newEncoder();
        this.decoder = decoder;
        this.infoColumns = new int[layout.infoBits()];
        for (int t = 0; t < infoColumns.length; t++) {
            infoColumns[t] = layout.infoColumn(t);
        }
        int runs = sentRuns(layout);
        this.runColumn = new int[runs];
        this.runSent = new int[runs];
        this.runLength = new int[runs];
        for (int p = 0, r = -1; p < layout.sentBits(); p++) {
            if (startsRun(layout, p)) {
                r++;
                runColumn[r] = layout.sentColumn(p);
                runSent[r] = p;
            }
            runLength[r]++;
        }
        this.word = new byte[layout.matrix().columns()];
        this.columnLlr = new double[layout.matrix().columns()];
    }

    /** The runs of consecutive columns among the sent columns of a layout (see {@link #runColumn}). */
    static int sentRuns(CodeLayout layout) {
        int runs = 0;
        for (int p = 0; p < layout.sentBits(); p++) {
            runs += startsRun(layout, p) ? 1 : 0;
        }
        return runs;
    }

    private static boolean startsRun(CodeLayout layout, int p) {
        return p == 0 || layout.sentColumn(p) != layout.sentColumn(p - 1) + 1;
    }

    @Override
    public void encode(byte[] info, int off, byte[] coded, int codedOff) {
        encoder.encode(info, off, word, 0);
        for (int r = 0; r < runColumn.length; r++) {
            System.arraycopy(word, runColumn[r], coded, codedOff + runSent[r], runLength[r]);
        }
    }

    @Override
    public void load(int lane, double[] llr, int off) {
        Lanes.checkLane(lane, decoder.lanes());
        for (int r = 0; r < runColumn.length; r++) {
            System.arraycopy(llr, off + runSent[r], columnLlr, runColumn[r], runLength[r]);
        }
        decoder.load(lane, columnLlr, 0);
    }

    @Override
    public void decode(int frames) {
        Lanes.checkFrames(frames, decoder.lanes());
        decoder.decode(frames);
        decodedLanes = frames;
    }

    @Override
    public int continuousLanes() {
        return decoder.continuousLanes();
    }

    @Override
    public int advance(int[] finished) {
        int count = decoder.advance(finished);
        decodedLanes = decoder.continuousLanes();
        return count;
    }

    @Override
    public void decided(int lane, byte[] info, int off) {
        Lanes.checkLane(lane, decodedLanes);
        for (int t = 0; t < infoColumns.length; t++) {
            info[off + t] = (byte) decoder.bit(lane, infoColumns[t]);
        }
    }

    @Override
    public int iterations(int lane) {
        Lanes.checkLane(lane, decodedLanes);
        return decoder.iterations(lane);
    }
}

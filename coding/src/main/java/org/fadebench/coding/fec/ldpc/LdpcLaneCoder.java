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
    private final int[] sentColumns;
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
        this.sentColumns = new int[layout.sentBits()];
        for (int p = 0; p < sentColumns.length; p++) {
            sentColumns[p] = layout.sentColumn(p);
        }
        this.word = new byte[layout.matrix().columns()];
        this.columnLlr = new double[layout.matrix().columns()];
    }

    @Override
    public void encode(byte[] info, int off, byte[] coded, int codedOff) {
        encoder.encode(info, off, word, 0);
        for (int p = 0; p < sentColumns.length; p++) {
            coded[codedOff + p] = word[sentColumns[p]];
        }
    }

    @Override
    public void load(int lane, double[] llr, int off) {
        Lanes.checkLane(lane, decoder.lanes());
        for (int p = 0; p < sentColumns.length; p++) {
            columnLlr[sentColumns[p]] = llr[off + p];
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

package dev.tare.overlap;

import java.util.Arrays;

/**
 * Non-negative {@code int}s written one after another in as few bytes as they need: seven bits a
 * byte, lowest first, with the top bit set on every byte but a number's last (the LEB128 form of
 * the DWARF debugging format, section 7.6). A number below 128 takes one byte, below 16,384 two,
 * and {@link Integer#MAX_VALUE} five.
 */
final class VarInts {
    /** The most bytes one number takes. */
    static final int MAX_BYTES = 5;

    private VarInts() {
    }

    /**
     * Writes {@code value} (at least 0) into {@code out} at {@code at}, which must have room for
     * {@link #MAX_BYTES}, and returns where the next number goes.
     */
    static int write(int value, byte[] out, int at) {
        if (value < 0) {
            throw new IllegalArgumentException("a negative number: " + value);
        }
        while (value >= 0x80) {
            out[at++] = (byte) (value | 0x80);
            value >>>= 7;
        }
        out[at++] = (byte) value;
        return at;
    }

    /** A growing array of numbers written one after another. */
    static final class Writer {
        private byte[] bytes = new byte[256];
        private int size;

        void write(int value) {
            if (size + MAX_BYTES > bytes.length) {
                bytes = Arrays.copyOf(bytes, bytes.length * 2);
            }
            size = VarInts.write(value, bytes, size);
        }

        /** The numbers written so far, in an array of their own. */
        byte[] toArray() {
            return Arrays.copyOf(bytes, size);
        }

        /** Starts again from no numbers, keeping the room. */
        void clear() {
            size = 0;
        }
    }

    /** Reads the numbers of one array in the order they were written. */
    static final class Reader {
        private final byte[] in;
        private int at;

        Reader(byte[] in) {
            this.in = in;
        }

        /** The next number. */
        int next() {
            int value = 0;
            for (int shift = 0; ; shift += 7) {
                byte b = in[at++];
                value |= (b & 0x7F) << shift;
                if (b >= 0) {
                    return value;
                }
            }
        }
    }
}

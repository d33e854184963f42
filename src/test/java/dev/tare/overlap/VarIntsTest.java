package dev.tare.overlap;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

class VarIntsTest {
    /** A number of at least 2^7(k-1) and below 2^7k takes k bytes. */
    @Test
    void numbersRoundTripInTheBytesTheirSizeNeeds() {
        int[] values = {0, 1, 0x7F, 0x80, 0x3FFF, 0x4000, 0x1F_FFFF, 0x20_0000, 0x0FFF_FFFF, 0x1000_0000, Integer.MAX_VALUE};
        int[] sizes = {1, 1, 1, 2, 2, 3, 3, 4, 4, 5, 5};
        byte[] out = new byte[values.length * VarInts.MAX_BYTES];
        int at = 0;
        for (int i = 0; i < values.length; i++) {
            int next = VarInts.write(values[i], out, at);
            assertEquals(sizes[i], next - at, "bytes of " + values[i]);
            at = next;
        }
        VarInts.Reader reader = new VarInts.Reader(out);
        for (int value : values) {
            assertEquals(value, reader.next());
        }
    }

    /**
     * The examples of unsigned LEB128 in the DWARF Debugging Information Format standard, section
     * 7.6 (versions 2 to 5): 2 is 02, 127 is 7F, 128 is 80 01, 129 is 81 01, 130 is 82 01 and 12857
     * is B9 64.
     */
    @Test
    void writesTheStandardsExamples() {
        int[] values = {2, 127, 128, 129, 130, 12857};
        int[][] bytes = {{0x02}, {0x7F}, {0x80, 0x01}, {0x81, 0x01}, {0x82, 0x01}, {0xB9, 0x64}};
        for (int i = 0; i < values.length; i++) {
            byte[] out = new byte[VarInts.MAX_BYTES];
            int written = VarInts.write(values[i], out, 0);
            List<Integer> expected = new ArrayList<>();
            for (int b : bytes[i]) {
                expected.add(b);
            }
            List<Integer> actual = new ArrayList<>();
            for (int k = 0; k < written; k++) {
                actual.add(out[k] & 0xFF);
            }
            assertEquals(expected, actual, "bytes of " + values[i]);
        }
    }

    @Test
    void randomNumbersComeBackInOrder() {
        Random random = new Random(7);
        List<Integer> values = new ArrayList<>();
        byte[] out = new byte[20_000 * VarInts.MAX_BYTES];
        int at = 0;
        for (int i = 0; i < 20_000; i++) {
            int value = random.nextInt(Integer.MAX_VALUE) >>> random.nextInt(31);
            values.add(value);
            at = VarInts.write(value, out, at);
        }
        VarInts.Reader reader = new VarInts.Reader(out);
        for (int value : values) {
            assertEquals(value, reader.next());
        }
    }

    @Test
    void aWriterGrowsAndStartsAgainWhenCleared() {
        VarInts.Writer writer = new VarInts.Writer();
        for (int i = 0; i < 1_000; i++) {
            writer.write(i * 1_000_003 & Integer.MAX_VALUE);
        }
        VarInts.Reader reader = new VarInts.Reader(writer.toArray());
        for (int i = 0; i < 1_000; i++) {
            assertEquals(i * 1_000_003 & Integer.MAX_VALUE, reader.next());
        }
        writer.clear();
        writer.write(300);
        assertEquals(2, writer.toArray().length);
        assertEquals(300, new VarInts.Reader(writer.toArray()).next());
    }

    @Test
    void refusesANegativeNumber() {
        assertThrows(IllegalArgumentException.class, () -> VarInts.write(-1, new byte[VarInts.MAX_BYTES], 0));
    }
}

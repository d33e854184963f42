package dev.tare.source;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The strict decoder against the JDK's UTF-8 decoder with malformed input reported (the JDK's
 * implementation of RFC 3629 and of Table 3-7 of the Unicode Standard): the same chars for every
 * input it accepts, and the same offset for the first sequence it refuses. A NUL byte, which the
 * JDK decodes, is refused at its own offset.
 */
class StrictUtf8Test {

    @Test
    void decodesAndRefusesAsTheJdksStrictDecoderOnRandomBytes() {
        SplittableRandom random = new SplittableRandom(20_261_202L);
        for (int round = 0; round < 50_000; round++) {
            byte[] bytes = randomBytes(random);
            assertSameAsJdk(bytes);
        }
    }

    /** Every lead byte followed by every second byte: the edges of Table 3-7, overlong forms and surrogates included. */
    @Test
    void decodesAndRefusesAsTheJdkOnEveryTwoByteStart() {
        for (int lead = 1; lead < 0x100; lead++) {
            for (int second = 0; second < 0x100; second++) {
                assertSameAsJdk(new byte[] {'a', (byte) lead, (byte) second, (byte) 0x80, (byte) 0x80, 'z'});
                assertSameAsJdk(new byte[] {(byte) lead, (byte) second});
            }
        }
    }

    /** Runs of ASCII are read eight bytes at a time: a NUL or a byte past ASCII is found at every place in one. */
    @Test
    void findsANulOrAByteBeyondAsciiAtEveryPlaceOfALongRun() {
        for (int at = 0; at < 20; at++) {
            for (int odd : new int[] {0x00, 0x7F, 0x80, 0xC3, 0xE2, 0xFF}) {
                byte[] bytes = "abcdefghijklmnopqrst".getBytes(StandardCharsets.US_ASCII);
                bytes[at] = (byte) odd;
                assertSameAsJdk(bytes);
            }
            byte[] accented = ("abcdefghijklmnopqrst".substring(0, at) + "\u00e9xyz").getBytes(StandardCharsets.UTF_8);
            assertSameAsJdk(accented);
        }
    }

    @Test
    void refusesANulByteAtItsOffset() {
        char[] out = new char[4];
        assertEquals(-1 - 2, StrictUtf8.decode(new byte[] {'a', 'b', 0, 'c'}, 0, 4, out));
        assertEquals(-1 - 0, StrictUtf8.decode(new byte[] {0}, 0, 1, out));
    }

    @Test
    void decodesARangeIntoTheStartOfTheArray() {
        byte[] bytes = "xx caf\u00e9 \uD83D\uDCA7".getBytes(StandardCharsets.UTF_8);
        char[] out = new char[bytes.length];
        int length = StrictUtf8.decode(bytes, 3, bytes.length, out);
        assertEquals("caf\u00e9 \uD83D\uDCA7", new String(out, 0, length));
    }

    private static void assertSameAsJdk(byte[] bytes) {
        char[] out = new char[bytes.length];
        int ours = StrictUtf8.decode(bytes, 0, bytes.length, out);
        CharsetDecoder jdk = StandardCharsets.UTF_8.newDecoder()
                .onMalformedInput(CodingErrorAction.REPORT)
                .onUnmappableCharacter(CodingErrorAction.REPORT);
        ByteBuffer in = ByteBuffer.wrap(bytes);
        CharBuffer chars = CharBuffer.allocate(bytes.length);
        CoderResult result = jdk.decode(in, chars, true);
        if (!result.isError()) {
            result = jdk.flush(chars);
        }
        int firstNul = -1;
        for (int i = 0; i < bytes.length && firstNul < 0; i++) {
            firstNul = bytes[i] == 0 ? i : -1;
        }
        int jdkRefusal = result.isError() ? in.position() : -1;
        int expectedRefusal = firstNul >= 0 && (jdkRefusal < 0 || firstNul < jdkRefusal) ? firstNul : jdkRefusal;
        String shown = hex(bytes);
        if (expectedRefusal >= 0) {
            assertEquals(-1 - expectedRefusal, ours, () -> "refusal of " + shown);
        } else {
            chars.flip();
            assertEquals(chars.toString(), new String(out, 0, ours), () -> "text of " + shown);
        }
    }

    /** Mostly well-formed UTF-8 of every width, with bytes dropped, changed or inserted now and then. */
    private static byte[] randomBytes(SplittableRandom random) {
        StringBuilder text = new StringBuilder();
        for (int i = random.nextInt(12); i > 0; i--) {
            int cp = switch (random.nextInt(4)) {
                case 0 -> random.nextInt(1, 0x80);
                case 1 -> random.nextInt(0x80, 0x800);
                case 2 -> random.nextInt(0x800, 0x10000);
                default -> random.nextInt(0x10000, 0x110000);
            };
            if (cp < Character.MIN_SURROGATE || cp > Character.MAX_SURROGATE) {
                text.appendCodePoint(cp);
            }
        }
        byte[] bytes = text.toString().getBytes(StandardCharsets.UTF_8);
        if (bytes.length > 0 && random.nextInt(3) == 0) {
            int at = random.nextInt(bytes.length);
            switch (random.nextInt(3)) {
                case 0 -> bytes[at] = (byte) random.nextInt(0x100);
                case 1 -> bytes = remove(bytes, at);
                default -> bytes = insert(bytes, at, (byte) random.nextInt(0x100));
            }
        }
        return bytes;
    }

    private static byte[] remove(byte[] bytes, int at) {
        byte[] shorter = new byte[bytes.length - 1];
        System.arraycopy(bytes, 0, shorter, 0, at);
        System.arraycopy(bytes, at + 1, shorter, at, bytes.length - at - 1);
        return shorter;
    }

    private static byte[] insert(byte[] bytes, int at, byte b) {
        byte[] longer = new byte[bytes.length + 1];
        System.arraycopy(bytes, 0, longer, 0, at);
        longer[at] = b;
        System.arraycopy(bytes, at, longer, at + 1, bytes.length - at);
        return longer;
    }

    private static String hex(byte[] bytes) {
        StringBuilder shown = new StringBuilder();
        for (byte b : bytes) {
            shown.append(String.format("%02X ", b & 0xFF));
        }
        return shown.toString().trim();
    }
}

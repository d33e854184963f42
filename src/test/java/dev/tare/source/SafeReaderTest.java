package dev.tare.source;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.TareException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;

class SafeReaderTest {
    private final SafeReader reader = new SafeReader(1024);

    private SourceText decode(byte[] bytes) {
        return reader.decode("t.md", Path.of("t.md"), bytes);
    }

    private String refusal(byte[] bytes) {
        return assertThrows(TareException.class, () -> decode(bytes)).getMessage();
    }

    @Test
    void stripsAndRemembersAUtf8ByteOrderMark() {
        SourceText text = decode(new byte[] {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF, 'h', 'i'});
        assertEquals("hi", text.text());
        assertTrue(text.hadBom());
        assertFalse(decode("hi".getBytes(StandardCharsets.UTF_8)).hadBom());
    }

    @Test
    void keepsAByteOrderMarkThatIsNotLeading() {
        assertEquals("a\uFEFFb", decode("a\uFEFFb".getBytes(StandardCharsets.UTF_8)).text());
    }

    @Test
    void refusesUtf16AndUtf32WithAdvice() {
        assertTrue(refusal(new byte[] {(byte) 0xFF, (byte) 0xFE, 'h', 0}).startsWith("UTF-16 encoded"));
        assertTrue(refusal(new byte[] {(byte) 0xFE, (byte) 0xFF, 0, 'h'}).contains("UTF-16"));
        assertTrue(refusal(new byte[] {(byte) 0xFF, (byte) 0xFE, 0, 0}).startsWith("UTF-32"));
        assertTrue(refusal(new byte[] {(byte) 0xFF, (byte) 0xFE, 'h', 0}).contains("save the file as UTF-8"));
    }

    @Test
    void refusesBinaryNamingTheOffset() {
        assertEquals("binary file (NUL byte at offset 2)", refusal(new byte[] {'a', 'b', 0, 'c'}));
    }

    @Test
    void refusesInvalidUtf8NamingOffsetAndLine() {
        byte[] bytes = {'a', '\n', 'b', '\n', (byte) 0xC3, '(', 'x'};
        String message = refusal(bytes);
        assertTrue(message.contains("offset 4, line 3"), message);
        assertTrue(refusal(new byte[] {'a', (byte) 0xE2, (byte) 0x82}).contains("not valid UTF-8"));
    }

    @Test
    void keepsAReplacementCharacterTheFileHolds() {
        assertEquals("a\uFFFDb", decode("a\uFFFDb".getBytes(StandardCharsets.UTF_8)).text());
        byte[] both = {(byte) 0xEF, (byte) 0xBF, (byte) 0xBD, '\n', 'x', (byte) 0xC3, '('};
        assertEquals("not valid UTF-8 (bad byte sequence at offset 5, line 2); save the file as UTF-8", refusal(both));
    }

    /**
     * The sequences Table 3-7 of the Unicode Standard leaves out are refused at their first byte:
     * overlong forms, surrogates, code points past U+10FFFF, a continuation byte without a lead, and
     * a sequence the file ends inside.
     */
    @Test
    void refusesWhatIsNotWellFormedAtItsFirstByte() {
        int[][] bad = {
            {0xC0, 0xAF}, {0xC1, 0xBF}, {0xE0, 0x80, 0xAF}, {0xF0, 0x80, 0x80, 0xAF},
            {0xED, 0xA0, 0x80}, {0xED, 0xBF, 0xBF},
            {0xF4, 0x90, 0x80, 0x80}, {0xF5, 0x80, 0x80, 0x80}, {0xFF},
            {0x80}, {0xBF, 'a'},
            {0xE2, 0x82}, {0xF0, 0x9F, 0x99},
        };
        for (int[] sequence : bad) {
            byte[] bytes = new byte[3 + sequence.length];
            bytes[0] = 'a';
            bytes[1] = '\n';
            bytes[2] = 'b';
            for (int i = 0; i < sequence.length; i++) {
                bytes[3 + i] = (byte) sequence[i];
            }
            assertEquals("not valid UTF-8 (bad byte sequence at offset 3, line 2); save the file as UTF-8", refusal(bytes),
                    () -> java.util.Arrays.toString(sequence));
        }
    }

    @Test
    void decodesEveryWidthUpToTheLastCodePoint() {
        String text = "a\u00e9\u07ff\u0800\ud7ff\ue000\uffff\ud800\udc00\udbff\udfff";
        assertEquals(text, decode(text.getBytes(StandardCharsets.UTF_8)).text());
    }

    /** The offset named is that of the odd byte, wherever it stands in a line. */
    @Test
    void namesTheOffsetOfAnOddByteAtEveryPlaceOfALine() {
        for (int at = 0; at < 20; at++) {
            byte[] bytes = "abcdefghijklmnopqrst".getBytes(StandardCharsets.US_ASCII);
            bytes[at] = (byte) 0x80;
            assertEquals("not valid UTF-8 (bad byte sequence at offset " + at + ", line 1); save the file as UTF-8",
                    refusal(bytes));
            bytes[at] = 0;
            assertEquals("binary file (NUL byte at offset " + at + ")", refusal(bytes));
        }
    }

    /** Offsets count the byte-order mark: they are offsets in the file. */
    @Test
    void countsTheByteOrderMarkInTheOffset() {
        byte[] bytes = {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF, 'a', (byte) 0xC3, '('};
        assertEquals("not valid UTF-8 (bad byte sequence at offset 4, line 1); save the file as UTF-8", refusal(bytes));
        SafeReader.Chars chars = reader.decodeChars("t.md", new byte[] {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF, 'c',
            (byte) 0xC3, (byte) 0xA9}, new char[8]);
        assertEquals("c\u00e9", new String(chars.array(), 0, chars.length()));
    }

    /** Random bytes, mostly valid UTF-8: the text or the refusal is what a strict decoder says. */
    @Test
    void decodesAsAStrictDecoderOnRandomBytes() {
        java.util.Random random = new java.util.Random(5);
        String[] pieces = {"a", " ", "\n", "\u00e9", "\u20ac", "\ud83d\ude42", "\uFFFD", "\u4e2d"};
        for (int round = 0; round < 3_000; round++) {
            java.io.ByteArrayOutputStream out = new java.io.ByteArrayOutputStream();
            for (int i = 0; i < 1 + random.nextInt(20); i++) {
                byte[] piece = pieces[random.nextInt(pieces.length)].getBytes(StandardCharsets.UTF_8);
                if (random.nextInt(15) == 0) {
                    piece = java.util.Arrays.copyOf(piece, Math.max(1, piece.length - 1));
                    piece[0] = random.nextBoolean() ? piece[0] : (byte) (0x80 + random.nextInt(0x7F));
                }
                out.write(piece, 0, piece.length);
            }
            byte[] bytes = out.toByteArray();
            java.nio.charset.CharsetDecoder strict = StandardCharsets.UTF_8.newDecoder()
                    .onMalformedInput(java.nio.charset.CodingErrorAction.REPORT);
            String expected;
            try {
                expected = strict.decode(java.nio.ByteBuffer.wrap(bytes)).toString();
            } catch (java.nio.charset.CharacterCodingException e) {
                expected = null;
            }
            if (expected != null) {
                assertEquals(expected, decode(bytes).text());
            } else {
                assertTrue(refusal(bytes).startsWith("not valid UTF-8"));
            }
        }
    }

    /** Decoding into a char array accepts and refuses exactly what decoding into a string does, with the same words. */
    @Test
    void decodingIntoCharsAgreesWithDecodingIntoAString() {
        java.util.Random random = new java.util.Random(11);
        String[] pieces = {"a", "\n", "\u00e9", "\ud83d\ude42", "\uFFFD", "\u0000", "\uFEFF"};
        char[] buffer = new char[4];
        for (int round = 0; round < 3_000; round++) {
            java.io.ByteArrayOutputStream out = new java.io.ByteArrayOutputStream();
            for (int i = 0; i < random.nextInt(12); i++) {
                byte[] piece = pieces[random.nextInt(pieces.length)].getBytes(StandardCharsets.UTF_8);
                out.write(piece, 0, random.nextInt(8) == 0 ? piece.length - 1 : piece.length);
            }
            byte[] bytes = out.toByteArray();
            String expected;
            try {
                expected = decode(bytes).text();
            } catch (TareException e) {
                expected = "refused: " + e.getMessage();
            }
            String actual;
            try {
                SafeReader.Chars chars = reader.decodeChars("t.md", bytes, buffer);
                actual = new String(chars.array(), 0, chars.length());
                buffer = chars.array();
            } catch (TareException e) {
                actual = "refused: " + e.getMessage();
            }
            assertEquals(expected, actual, () -> java.util.Arrays.toString(bytes));
        }
    }

    @Test
    void decodesCharsIntoTheBufferGivenWhenItIsLargeEnough(@org.junit.jupiter.api.io.TempDir Path dir) throws Exception {
        Path file = java.nio.file.Files.write(dir.resolve("a.md"), new byte[] {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF, 'h', 'i'});
        char[] buffer = new char[2];
        SafeReader.Chars chars = reader.readChars("a.md", file, buffer);
        assertTrue(chars.array() == buffer, "the buffer given is used");
        assertEquals("hi", new String(chars.array(), 0, chars.length()));
        assertEquals("a.md", chars.path());
        SafeReader.Chars larger = reader.decodeChars("b.md", "hello".getBytes(StandardCharsets.UTF_8), buffer);
        assertEquals("hello", new String(larger.array(), 0, larger.length()));
    }

    /** A file with a NUL byte anywhere is called binary, even where a bad sequence comes first. */
    @Test
    void callsAFileWithANulBinaryBeforeCallingItInvalid() {
        byte[] bytes = {(byte) 0xC3, '(', 0};
        assertEquals("binary file (NUL byte at offset 2)", refusal(bytes));
        String message = assertThrows(TareException.class, () -> reader.decodeChars("t.md", bytes, new char[8])).getMessage();
        assertEquals("binary file (NUL byte at offset 2)", message);
    }

    @Test
    void refusesFilesOverTheLimitNamingTheSetting() {
        String message = refusal(new byte[1025]);
        assertTrue(message.contains("1025 bytes > 1024"), message);
        assertTrue(message.contains("templates.max_file_bytes"), message);
    }

    @Test
    void readsAFileFromDisk(@org.junit.jupiter.api.io.TempDir Path dir) throws Exception {
        Path file = java.nio.file.Files.writeString(dir.resolve("a.md"), "caf\u00e9 \uD83D\uDCA7");
        SourceText text = reader.read("a.md", file);
        assertEquals("caf\u00e9 \uD83D\uDCA7", text.text());
        assertEquals(10, text.byteSize());
    }

    @Test
    void readsFilesFromDiskUpToTheLimit(@org.junit.jupiter.api.io.TempDir Path dir) throws Exception {
        Path empty = java.nio.file.Files.write(dir.resolve("empty.md"), new byte[0]);
        assertEquals("", reader.read("empty.md", empty).text());
        byte[] full = "x".repeat(1024).getBytes(StandardCharsets.UTF_8);
        Path atLimit = java.nio.file.Files.write(dir.resolve("full.md"), full);
        assertEquals(1024, reader.read("full.md", atLimit).text().length());
        Path over = java.nio.file.Files.write(dir.resolve("over.md"), "x".repeat(1025).getBytes(StandardCharsets.UTF_8));
        String message = assertThrows(TareException.class, () -> reader.read("over.md", over)).getMessage();
        assertTrue(message.contains("1025 bytes > 1024"), message);
    }

    /** A file without a size (a pipe) is read in chunks, up to the limit. */
    @Test
    void readsAPipe(@org.junit.jupiter.api.io.TempDir Path dir) throws Exception {
        Path pipe = dir.resolve("pipe.md");
        boolean made;
        try {
            made = new ProcessBuilder("mkfifo", pipe.toString()).start().waitFor() == 0;
        } catch (java.io.IOException e) {
            made = false;
        }
        org.junit.jupiter.api.Assumptions.assumeTrue(made, "mkfifo is needed to make a pipe");
        Thread writer = new Thread(() -> {
            try {
                java.nio.file.Files.writeString(pipe, "from a pipe");
            } catch (java.io.IOException e) {
                throw new java.io.UncheckedIOException(e);
            }
        });
        writer.start();
        assertEquals("from a pipe", reader.read("pipe.md", pipe).text());
        writer.join();
    }
}

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
}

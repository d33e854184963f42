package dev.tare.source;

import dev.tare.TareException;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.channels.Channels;
import java.nio.channels.SeekableByteChannel;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;

/**
 * The one way Tare reads a template file: UTF-8 only, a leading byte-order mark stripped and
 * remembered, and anything that is not a UTF-8 text file of a sane size refused with a reason.
 */
public final class SafeReader {
    /** The default largest file read, in bytes (2 MiB); larger files are skipped. */
    public static final long DEFAULT_MAX_BYTES = 2L * 1024 * 1024;

    private final long maxBytes;

    public SafeReader(long maxBytes) {
        if (maxBytes <= 0) {
            throw new IllegalArgumentException("maxBytes must be positive: " + maxBytes);
        }
        this.maxBytes = maxBytes;
    }

    /**
     * Reads {@code file}, shown to users as {@code path}.
     *
     * @throws TareException with the reason the file cannot be used (not prefixed with its path)
     */
    public SourceText read(String path, Path file) {
        byte[] bytes = readBounded(file);
        return decode(path, file, bytes);
    }

    /**
     * Decodes bytes that came from somewhere other than the file system (standard input, the git
     * index) under the same rules as {@link #read}.
     */
    public SourceText decode(String path, Path file, byte[] bytes) {
        int start = textStart(bytes);
        return new SourceText(path, file, decodeUtf8(bytes, start), start > 0, bytes.length);
    }

    /**
     * A file's text decoded into a char array, for reading many files one after another without a
     * {@code String} each (counting does this): {@code buffer} when it is large enough, else a new
     * array, which the caller can pass next time.
     */
    public record Chars(String path, char[] array, int length) {
    }

    /** Reads {@code file} as {@link #read} does, into {@code buffer} or a larger array. */
    public Chars readChars(String path, Path file, char[] buffer) {
        return decodeChars(path, readBounded(file), buffer);
    }

    /** Decodes bytes as {@link #decode} does, into {@code buffer} or a larger array. */
    public Chars decodeChars(String path, byte[] bytes, char[] buffer) {
        int start = textStart(bytes);
        char[] chars = buffer.length >= bytes.length - start ? buffer : new char[bytes.length - start];
        CharBuffer decoded = CharBuffer.wrap(chars);
        decodeOrRefuse(bytes, start, decoded);
        return new Chars(path, chars, decoded.position());
    }

    /** Where the text of {@code bytes} starts (after a UTF-8 byte-order mark), once size and encoding are checked. */
    private int textStart(byte[] bytes) {
        if (bytes.length > maxBytes) {
            throw new TareException(tooLarge(bytes.length));
        }
        String bomProblem = foreignByteOrderMark(bytes);
        if (bomProblem != null) {
            throw new TareException(bomProblem + "; save the file as UTF-8");
        }
        boolean bom = bytes.length >= 3 && (bytes[0] & 0xFF) == 0xEF && (bytes[1] & 0xFF) == 0xBB && (bytes[2] & 0xFF) == 0xBF;
        return bom ? 3 : 0;
    }

    /**
     * The file's bytes, at most {@code maxBytes} of them. A file is read into one array of the size
     * its channel reports, and one more byte is asked for to see that it ends there; what a file
     * without a size (a pipe) or one that grew meanwhile holds beyond that is read in chunks, up to
     * the limit. One array per file instead of a list of chunks and a copy: reading was a sixth of
     * what a cold scan allocated.
     */
    private byte[] readBounded(Path file) {
        try (SeekableByteChannel channel = Files.newByteChannel(file)) {
            long size = channel.size();
            if (size > maxBytes) {
                throw new TareException(tooLarge(size));
            }
            byte[] bytes = new byte[(int) size];
            ByteBuffer buffer = ByteBuffer.wrap(bytes);
            while (buffer.hasRemaining() && channel.read(buffer) >= 0) {
                // until the array is full or the file ends early
            }
            if (buffer.hasRemaining()) {
                return Arrays.copyOf(bytes, buffer.position());
            }
            ByteBuffer next = ByteBuffer.allocate(1);
            if (channel.read(next) < 0) {
                return bytes;
            }
            byte[] rest = Channels.newInputStream(channel).readNBytes((int) Math.min(Integer.MAX_VALUE - 8, maxBytes - size));
            if (size + 1 + rest.length > maxBytes) {
                throw new TareException(tooLarge(Math.max(Files.size(file), size + 1 + rest.length)));
            }
            byte[] all = Arrays.copyOf(bytes, bytes.length + 1 + rest.length);
            all[bytes.length] = next.get(0);
            System.arraycopy(rest, 0, all, bytes.length + 1, rest.length);
            return all;
        } catch (IOException e) {
            throw new TareException("cannot be read (" + IoProblem.describe(e) + ")", e);
        }
    }

    private String tooLarge(long size) {
        return "larger than the size limit (" + size + " bytes > " + maxBytes
                + "); raise templates.max_file_bytes in tare.yaml or exclude the file";
    }

    private static String foreignByteOrderMark(byte[] b) {
        if (b.length >= 4 && (b[0] & 0xFF) == 0xFF && (b[1] & 0xFF) == 0xFE && b[2] == 0 && b[3] == 0) {
            return "UTF-32 encoded (byte-order mark FF FE 00 00)";
        }
        if (b.length >= 4 && b[0] == 0 && b[1] == 0 && (b[2] & 0xFF) == 0xFE && (b[3] & 0xFF) == 0xFF) {
            return "UTF-32 encoded (byte-order mark 00 00 FE FF)";
        }
        if (b.length >= 2 && (b[0] & 0xFF) == 0xFF && (b[1] & 0xFF) == 0xFE) {
            return "UTF-16 encoded (byte-order mark FF FE)";
        }
        if (b.length >= 2 && (b[0] & 0xFF) == 0xFE && (b[1] & 0xFF) == 0xFF) {
            return "UTF-16 encoded (byte-order mark FE FF)";
        }
        return null;
    }

    /**
     * The text of valid UTF-8 without NUL, or an error naming the first bad byte. The JDK's own
     * {@code String} decoding, much the fastest, replaces every malformed sequence with U+FFFD, so a
     * text without U+FFFD (and without NUL) came from valid input; only a text that has one is
     * decoded again strictly, to tell a genuine U+FFFD from a bad byte and to find where it is.
     */
    private static String decodeUtf8(byte[] bytes, int start) {
        String text = new String(bytes, start, bytes.length - start, StandardCharsets.UTF_8);
        if (text.indexOf('\uFFFD') < 0 && text.indexOf('\0') < 0) {
            return text;
        }
        CharBuffer chars = CharBuffer.allocate(bytes.length - start);
        decodeOrRefuse(bytes, start, chars);
        return chars.flip().toString();
    }

    /**
     * Decodes {@code bytes} from {@code start} into {@code chars} (a UTF-8 sequence never decodes to
     * more chars than it has bytes, so room for one char a byte is enough), or refuses them: a file
     * with a NUL byte anywhere is binary; otherwise the JDK's decoder, with malformed input reported
     * rather than replaced, stops at the first sequence that is not well-formed UTF-8, and its input
     * position says where that is.
     */
    private static void decodeOrRefuse(byte[] bytes, int start, CharBuffer chars) {
        for (int i = start; i < bytes.length; i++) {
            if (bytes[i] == 0) {
                throw new TareException("binary file (NUL byte at offset " + i + ")");
            }
        }
        CharsetDecoder decoder = StandardCharsets.UTF_8.newDecoder()
                .onMalformedInput(CodingErrorAction.REPORT)
                .onUnmappableCharacter(CodingErrorAction.REPORT);
        ByteBuffer in = ByteBuffer.wrap(bytes, start, bytes.length - start);
        CoderResult result = decoder.decode(in, chars, true);
        if (!result.isError()) {
            result = decoder.flush(chars);
        }
        if (result.isError()) {
            throw new TareException(invalidUtf8(bytes, in.position()));
        }
    }

    private static String invalidUtf8(byte[] bytes, int offset) {
        int line = 1;
        for (int i = 0; i < offset && i < bytes.length; i++) {
            if (bytes[i] == '\n') {
                line++;
            }
        }
        return "not valid UTF-8 (bad byte sequence at offset " + offset + ", line " + line
                + "); save the file as UTF-8";
    }
}

package dev.tare.app;

import dev.tare.cache.TemplateCache;
import dev.tare.footprint.CallSize;
import dev.tare.overlap.CachePrefixes;
import dev.tare.template.Rendering;
import dev.tare.template.TemplateKind;
import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;

/**
 * How the scan keeps a file's {@link Measurement}s in its {@link TemplateCache}: one for a template
 * file, one per prompt for a source file.
 */
final class MeasurementCodec implements TemplateCache.Codec<List<Measurement>> {
    @Override
    public void write(DataOutputStream out, List<Measurement> measurements) throws IOException {
        out.writeInt(measurements.size());
        for (Measurement measurement : measurements) {
            write(out, measurement);
        }
    }

    @Override
    public List<Measurement> read(DataInputStream in, String path) throws IOException {
        int count = in.readInt();
        List<Measurement> measurements = new ArrayList<>(count);
        for (int i = 0; i < count; i++) {
            measurements.add(read(in, path, in.readUTF(), in.readInt()));
        }
        return measurements;
    }

    private static void write(DataOutputStream out, Measurement r) throws IOException {
        out.writeUTF(r.name());
        out.writeInt(r.line());
        out.writeUTF(r.kind().name());
        out.writeBoolean(r.callsPerDay().isPresent());
        if (r.callsPerDay().isPresent()) {
            out.writeDouble(r.callsPerDay().getAsDouble());
        }
        out.writeInt(r.characters());
        out.writeInt(r.staticTokens());
        out.writeInt(r.estimatedTokens());
        out.writeInt(r.shortestEstimatedTokens());
        writeStrings(out, r.variables());
        writeStrings(out, r.unsizedVariables());
        writeStrings(out, r.includes());
        out.writeInt(r.loops().size());
        for (Rendering.Loop loop : r.loops()) {
            out.writeUTF(loop.variable());
            out.writeUTF(loop.iterable());
            out.writeInt(loop.items());
            out.writeBoolean(loop.declared());
            out.writeUTF(loop.owner());
            out.writeInt(loop.line());
        }
        writeStrings(out, r.notes());
        out.writeInt(r.callSizes().size());
        for (Map.Entry<String, CallSize> size : r.callSizes().entrySet()) {
            CallSize s = size.getValue();
            out.writeUTF(size.getKey());
            out.writeInt(s.inputTokens());
            out.writeInt(s.framingTokens());
            out.writeInt(s.outputTokens());
            out.writeInt(s.staticPrefixTokens());
            out.writeInt(r.estimatedByTarget().getOrDefault(size.getKey(), 0));
        }
        out.writeInt(r.leadingIds().size());
        for (Map.Entry<String, CachePrefixes.LeadingIds> leading : r.leadingIds().entrySet()) {
            CachePrefixes.LeadingIds ids = leading.getValue();
            out.writeUTF(leading.getKey());
            out.writeUTF(ids.head());
            writeInts(out, ids.now());
            boolean same = Arrays.equals(ids.now(), ids.reordered());
            out.writeBoolean(same);
            if (!same) {
                writeInts(out, ids.reordered());
            }
        }
    }

    private static Measurement read(DataInputStream in, String path, String prompt, int line) throws IOException {
        TemplateKind kind = TemplateKind.valueOf(in.readUTF());
        OptionalDouble callsPerDay = in.readBoolean() ? OptionalDouble.of(in.readDouble()) : OptionalDouble.empty();
        int characters = in.readInt();
        int staticTokens = in.readInt();
        int estimatedTokens = in.readInt();
        int shortestEstimatedTokens = in.readInt();
        List<String> variables = readStrings(in);
        List<String> unsized = readStrings(in);
        List<String> includes = readStrings(in);
        int loopCount = in.readInt();
        List<Rendering.Loop> loops = new ArrayList<>(loopCount);
        for (int i = 0; i < loopCount; i++) {
            loops.add(new Rendering.Loop(in.readUTF(), in.readUTF(), in.readInt(), in.readBoolean(), in.readUTF(),
                    in.readInt()));
        }
        List<String> notes = readStrings(in);
        Map<String, CallSize> sizes = new LinkedHashMap<>();
        Map<String, Integer> byTarget = new LinkedHashMap<>();
        int targetCount = in.readInt();
        for (int t = 0; t < targetCount; t++) {
            String name = in.readUTF();
            sizes.put(name, new CallSize(in.readInt(), in.readInt(), in.readInt(), in.readInt()));
            byTarget.put(name, in.readInt());
        }
        Map<String, CachePrefixes.LeadingIds> leading = new LinkedHashMap<>();
        int leadingCount = in.readInt();
        for (int t = 0; t < leadingCount; t++) {
            String name = in.readUTF();
            String head = in.readUTF();
            int[] now = readInts(in);
            leading.put(name, new CachePrefixes.LeadingIds(head, now, in.readBoolean() ? now : readInts(in)));
        }
        return new Measurement(path, prompt, line, kind, characters, staticTokens, estimatedTokens, shortestEstimatedTokens, variables,
                unsized, includes, loops, sizes, byTarget, leading, callsPerDay, notes);
    }

    private static void writeInts(DataOutputStream out, int[] ints) throws IOException {
        out.writeInt(ints.length);
        for (int i : ints) {
            out.writeInt(i);
        }
    }

    private static int[] readInts(DataInputStream in) throws IOException {
        int[] ints = new int[in.readInt()];
        for (int i = 0; i < ints.length; i++) {
            ints[i] = in.readInt();
        }
        return ints;
    }

    private static void writeStrings(DataOutputStream out, List<String> strings) throws IOException {
        out.writeInt(strings.size());
        for (String s : strings) {
            out.writeUTF(s);
        }
    }

    private static List<String> readStrings(DataInputStream in) throws IOException {
        int n = in.readInt();
        List<String> strings = new ArrayList<>(n);
        for (int i = 0; i < n; i++) {
            strings.add(in.readUTF());
        }
        return strings;
    }
}

package dev.tare.footprint;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.TareException;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The sweep table against values worked out by hand from the design's formulas. */
class SweepTest {
    /**
     * A 1e9-parameter model (16 layers, 8 heads and 4 KV heads of size 64) on a device with 4 GiB,
     * half usable (2,147,483,648 bytes), 10 TFLOPS at 0.5 efficiency and 4 GB/s; 1,000 input and 24
     * output tokens. Per combination, by hand:
     * <ul>
     * <li>weights 1e9 × bits / 8: 2e9, 1e9, 5e8 bytes;</li>
     * <li>KV per token 2 × 16 × 4 × 64 × bits / 8: 16,384 or 8,192 bytes; × 1,024 tokens: 16,777,216 or 8,388,608;</li>
     * <li>max concurrent floor((2,147,483,648 − weights) / KV cache): 8, 17, 68, 136, 98, 196;</li>
     * <li>prefill FLOPs 2 × 1e9 × 1000 + 2 × 16 × 1000² × 512 = 2,016,384,000,000, so 403.2768 ms of compute
     *     at 5e12 FLOP/s; at 16 bits the 2e9 bytes of weights take 500 ms to read at 4 GB/s, which wins;</li>
     * <li>decode (weights + KV cache) / 4e9 × 1000: 504.194304, 502.097152, 254.194304, 252.097152,
     *     129.194304, 127.097152 ms.</li>
     * </ul>
     */
    @Test
    void weightAndKvBitsSweepMatchesHandComputedTable() {
        Target target = Targets.device(Targets.model(1e9, 16, 8, 4, 64), 16, 16,
                Targets.device(4, 0.5, 10, 4, 0.5));
        List<Sweep.Row> rows = Sweep.run(target, CallSize.of(1000, 24),
                List.of(Sweep.Axis.parse("weight_bits=16,8,int4"), Sweep.Axis.parse("kv_bits=fp16,8")));
        double[][] expected = {
            // weight bits, kv bits, weight bytes, kv cache bytes, max concurrent, prefill ms, decode ms
            {16, 16, 2e9, 16_777_216, 8, 500, 504.194304},
            {16, 8, 2e9, 8_388_608, 17, 500, 502.097152},
            {8, 16, 1e9, 16_777_216, 68, 403.2768, 254.194304},
            {8, 8, 1e9, 8_388_608, 136, 403.2768, 252.097152},
            {4, 16, 5e8, 16_777_216, 98, 403.2768, 129.194304},
            {4, 8, 5e8, 8_388_608, 196, 403.2768, 127.097152},
        };
        assertEquals(expected.length, rows.size());
        for (int i = 0; i < expected.length; i++) {
            Sweep.Row row = rows.get(i);
            Footprint f = row.footprint();
            String at = "row " + i;
            assertEquals(List.of(expected[i][0], expected[i][1]), row.settings(), at);
            assertEquals((long) expected[i][2], f.weightBytes().getAsLong(), at);
            assertEquals((long) expected[i][3], f.kvCacheBytes().getAsLong(), at);
            assertEquals((long) expected[i][4], f.maxConcurrent().getAsLong(), at);
            assertEquals(expected[i][5], f.prefillMillis().getAsDouble(), 1e-9, at);
            assertEquals(expected[i][6], f.decodeMillisPerToken().getAsDouble(), 1e-9, at);
        }
    }

    @Test
    void deviceMemoryAndPromptSizeCanBeSwept() {
        Target target = Targets.device(Targets.model(1e9, 16, 8, 4, 64), 16, 16,
                Targets.device(4, 0.5, 10, 4, 0.5));
        List<Sweep.Row> rows = Sweep.run(target, CallSize.of(1000, 24),
                List.of(Sweep.Axis.parse("memory_gib=4,8"), Sweep.Axis.parse("input_tokens=1000,2024")));
        // 8 GiB half usable = 4,294,967,296; minus 2e9 = 2,294,967,296; KV for 1,024 tokens 16,777,216 -> 136;
        // for 2,048 tokens 33,554,432 -> 68. At 4 GiB: 8 and floor(147,483,648 / 33,554,432) = 4.
        assertEquals(List.of(8L, 4L, 136L, 68L), rows.stream().map(r -> r.footprint().maxConcurrent().getAsLong()).toList());
    }

    @Test
    void badSweepsAreRefusedNamingTheKey() {
        Target device = Targets.device(Targets.model(1e9, 16, 8, 4, 64), 16, 16,
                Targets.device(4, 0.5, 10, 4, 0.5));
        assertMessage(() -> Sweep.Axis.parse("weight=16,8"), "unknown key 'weight'");
        assertMessage(() -> Sweep.Axis.parse("kv_bits=16,fp7"), "unknown precision 'fp7'");
        assertMessage(() -> Sweep.Axis.parse("usable_fraction=1.5"), "at most 1");
        assertMessage(() -> Sweep.Axis.parse("weight_bits"), "KEY=V1,V2");
        assertMessage(() -> Sweep.run(device, CallSize.of(10, 0),
                List.of(Sweep.Axis.parse("kv_bits=16"), Sweep.Axis.parse("kv_bits=8"))), "given twice");
        assertMessage(() -> Sweep.run(Targets.priced(1, 1, 1, null, 1), CallSize.of(10, 0),
                List.of(Sweep.Axis.parse("weight_bits=16,8"))), "has no model");
        assertMessage(() -> Sweep.run(device, CallSize.of(10, 0), List.of(
                Sweep.Axis.parse("input_tokens=" + "1,".repeat(40) + "1"),
                Sweep.Axis.parse("output_tokens=" + "1,".repeat(40) + "1"))), "more than 1000 combinations");
    }

    private static void assertMessage(org.junit.jupiter.api.function.Executable call, String fragment) {
        TareException e = assertThrows(TareException.class, call);
        assertTrue(e.getMessage().contains(fragment), e.getMessage());
    }
}

package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code tare targets} and {@code tare targets --catalog}. */
class TargetsCommandTest {
    @TempDir
    Path root;

    @Test
    void listsTargetsWithWhatTheyEstimateAndLack() throws IOException {
        Path config = Files.writeString(root.resolve("tare.yaml"), """
                targets:
                  - name: hosted
                    tokenizer: o200k_base
                    price: {input: 1, output: 2}
                  - name: edge
                    tokenizer: cl100k_base
                    model: qwen2-0.5b
                    kv_bits: bf16
                    device: {catalog: phone-12gb, memory_gib: 8}
                """, StandardCharsets.UTF_8);
        Cli.Run text = Cli.run("targets", "--config", config.toString());
        assertEquals(0, text.exitCode(), text.err());
        assertTrue(text.out().contains("hosted") && text.out().contains("edge"), text.out());
        assertTrue(text.out().contains("cost_per_month, cost_per_month_uncached not estimated; set calls_per_day"), text.out());
        assertTrue(text.out().contains("weight_bytes") && text.out().contains("set weight_bits"), text.out());
        assertTrue(text.out().contains("catalog device phone-12gb with overrides: 8 GiB"), text.out());
        assertTrue(text.out().contains("planning estimates"), text.out());

        Cli.Run json = Cli.run("targets", "--config", config.toString(), "--format", "json");
        JsonNode edge = new ObjectMapper().readTree(json.out()).get("targets").get(1);
        assertEquals("edge", edge.get("name").asText());
        assertTrue(edge.get("computes").toString().contains("kv_cache_bytes"));
        assertEquals("[\"weight_bits\"]", edge.get("missing").get("weight_bytes").toString());
    }

    @Test
    void catalogListsEveryEntryWithItsSource() throws IOException {
        Cli.Run text = Cli.run("targets", "--catalog");
        assertEquals(0, text.exitCode(), text.err());
        assertTrue(text.out().contains("opt-13b") && text.out().contains("Zhang et al. 2022"), text.out());
        assertTrue(text.out().contains("laptop-16gb") && text.out().contains("(from memory)"), text.out());
        // 2 × 40 × 40 × 128 × 2 bytes = 819,200 = 800 KiB per token (the PagedAttention §3 example; from memory).
        assertTrue(text.out().lines().anyMatch(l -> l.startsWith("opt-13b") && l.contains("800 KiB")), text.out());
        JsonNode json = new ObjectMapper().readTree(Cli.run("targets", "--catalog", "--format", "json").out());
        for (JsonNode model : json.get("models")) {
            assertTrue(!model.get("source").asText().isBlank() && model.has("from_memory"), model.toString());
        }
        assertTrue(json.get("devices").size() >= 3);
    }
}

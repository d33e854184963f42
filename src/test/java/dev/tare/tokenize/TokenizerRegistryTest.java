package dev.tare.tokenize;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.TareException;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Tokenizers loaded ahead of use on a background thread are the same ones, and their failures still reach the caller. */
class TokenizerRegistryTest {
    @TempDir
    Path folder;

    @Test
    void preloadedTokenizersAreTheOnesGetReturnsAndCountTheSame() {
        TokenizerRegistry preloaded = new TokenizerRegistry();
        preloaded.preload(List.of("cl100k_base", "o200k_base", "cl100k_base"), folder);
        TokenizerRegistry plain = new TokenizerRegistry();
        String text = "Preloading must not change a single count: caf\u00e9, 12345, \ud83d\ude00 and tabs\t\there.";
        for (String name : List.of("o200k_base", "cl100k_base")) {
            Tokenizer first = preloaded.get(name, folder);
            assertSame(first, preloaded.get(name, folder), name + " is made once");
            assertEquals(plain.get(name, folder).count(text), first.count(text), name);
        }
    }

    @Test
    void loadingInTheBackgroundIsNotACommandsLoadTimeButWaitingForItIs() {
        TokenizerRegistry registry = new TokenizerRegistry();
        Tokenizer r50k = registry.get("r50k_base", folder);
        double before = TokenizerRegistry.loadMillis();
        TokenizerRegistry.prepare(List.of(r50k)).join();
        assertEquals(before, TokenizerRegistry.loadMillis(), "the vocabulary was read on the background thread");
        Tokenizer p50k = registry.get("p50k_base", folder);
        p50k.prepare();
        assertTrue(TokenizerRegistry.loadMillis() > before, "read on this thread, it counts");
    }

    @Test
    void aTokenizerThatFailsInTheBackgroundFailsAgainWhereItIsAskedFor() {
        TokenizerRegistry registry = new TokenizerRegistry();
        registry.preload(List.of("models/missing/tokenizer.json", "cl100k_base"), folder).join();
        assertTrue(registry.get("cl100k_base", folder).count("still loaded after the failure") > 0);
        TareException error = assertThrows(TareException.class, () -> registry.get("models/missing/tokenizer.json", folder));
        assertTrue(error.getMessage().contains("tokenizer.json"), error.getMessage());
    }
}

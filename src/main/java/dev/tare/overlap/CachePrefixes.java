package dev.tare.overlap;

import dev.tare.footprint.CallSize;
import dev.tare.footprint.Footprint;
import dev.tare.footprint.Footprints;
import dev.tare.footprint.PrefixCache;
import dev.tare.footprint.Target;
import dev.tare.footprint.Traffic;
import dev.tare.template.Renderer;
import dev.tare.template.Rendering;
import dev.tare.template.Template;
import dev.tare.tokenize.Tokenizer;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.OptionalDouble;
import java.util.function.Function;

/**
 * Prefix caching across the templates of a repository (design.md, "Prefix caching"): each
 * template's static prefix on a target with a prefix cache, how much of it the cache holds, and how
 * often it is found there, from the traffic of every template whose calls begin with the same
 * cacheable tokens; as the templates stand, and as they would be with every template's per-call
 * parts after its static parts. The leading token ids of each template are taken once
 * ({@link #leading}); {@link #share} then compares all of them at once, sorted.
 */
public final class CachePrefixes {
    /**
     * The most leading token ids kept per template and target: enough for any cache threshold in
     * use, and a bound on the memory a large repository takes.
     */
    public static final int MAX_LEADING_IDS = 16_384;

    private CachePrefixes() {
    }

    /**
     * A template's leading texts, message by message: as written, and reordered.
     *
     * @param now       the text before the first per-call part
     * @param reordered the static text of every message, as if the per-call parts came last
     */
    public record Texts(List<String> now, List<String> reordered) {
        public Texts {
            now = List.copyOf(now);
            reordered = List.copyOf(reordered);
        }
    }

    /**
     * A template's leading token ids on one tokenizer, at most {@link #MAX_LEADING_IDS} each.
     *
     * @param head      what a request sends before the template's text: its tool files, by path
     * @param now       the ids of the text before the first per-call part
     * @param reordered the ids of the reordered text (the same array when the template has no variable)
     */
    public record LeadingIds(String head, int[] now, int[] reordered) {
    }

    /**
     * One template's call on the target, and its leading ids there.
     *
     * @param call    the call, its static prefix as written included
     * @param leading the leading ids the prefix ends in
     * @param traffic how often the template is called
     */
    public record Prefix(CallSize call, LeadingIds leading, Traffic traffic) {
        /** The static prefix with every per-call part last: the same tools and framing, the reordered text. */
        int reorderedTokens(Target target) {
            int text = target.scaled(leading.now().length);
            return Math.min(call.inputTokens(), call.staticPrefixTokens() - text + target.scaled(leading.reordered().length));
        }
    }

    /**
     * A template's footprint with its prefix cached as the traffic of every template sharing it
     * allows, and what reordering would change.
     *
     * @param footprint the footprint as the template stands
     * @param share     the prefix beside it
     */
    public record Shared(Footprint footprint, PrefixShare share) {
    }

    /** The leading texts of {@code template}, rendered once and shared by every target. */
    public static Texts texts(Template template, Renderer renderer, Rendering samples) {
        List<String> now = StaticPrefix.of(samples);
        List<String> reordered = samples.variables().isEmpty() ? now : StaticPrefix.reordered(template, renderer);
        return new Texts(now, reordered);
    }

    /** The leading token ids of {@code texts} on {@code tokenizer}, after {@code head}. */
    public static LeadingIds leading(String head, Texts texts, Tokenizer tokenizer) {
        int[] now = ids(tokenizer, texts.now());
        int[] reordered = texts.reordered().equals(texts.now()) ? now : ids(tokenizer, texts.reordered());
        return new LeadingIds(head, now, reordered);
    }

    private static int[] ids(Tokenizer tokenizer, List<String> messages) {
        int[] kept = new int[0];
        for (String message : messages) {
            int[] ids = tokenizer.encode(message);
            int take = Math.min(ids.length, MAX_LEADING_IDS - kept.length);
            int[] joined = Arrays.copyOf(kept, kept.length + take);
            System.arraycopy(ids, 0, joined, kept.length, take);
            kept = joined;
            if (kept.length == MAX_LEADING_IDS) {
                break;
            }
        }
        return kept;
    }

    /**
     * Each template's footprint on {@code target}, which must have a prefix cache, with the traffic
     * of the templates sharing its cacheable prefix, and the same with every per-call part last.
     *
     * @return one result per prefix, in the same order
     */
    public static List<Shared> share(Target target, List<Prefix> prefixes) {
        PrefixCache cache = target.prefixCache().orElseThrow(
                () -> new IllegalArgumentException("target " + target.name() + " has no prefix cache"));
        int n = prefixes.size();
        List<CallSize> now = new ArrayList<>(n);
        List<CallSize> reordered = new ArrayList<>(n);
        for (Prefix prefix : prefixes) {
            now.add(prefix.call());
            reordered.add(prefix.call().withStaticPrefix(prefix.reorderedTokens(target)));
        }
        double[] pooledNow = pooled(target, cache, prefixes, now, LeadingIds::now);
        double[] pooledReordered = pooled(target, cache, prefixes, reordered, LeadingIds::reordered);
        List<Shared> shared = new ArrayList<>(n);
        for (int i = 0; i < n; i++) {
            Traffic traffic = prefixes.get(i).traffic();
            Footprint footprint = Footprints.estimate(target, now.get(i), traffic.sharedBy(pooledNow[i]));
            Footprint whenReordered = Footprints.estimate(target, reordered.get(i), traffic.sharedBy(pooledReordered[i]));
            shared.add(new Shared(footprint, new PrefixShare(reordered.get(i).staticPrefixTokens(),
                    saving(footprint), saving(whenReordered))));
        }
        return shared;
    }

    /** The calls a day of the templates whose first C tokens equal each one's, C its cacheable prefix. */
    private static double[] pooled(Target target, PrefixCache cache, List<Prefix> prefixes, List<CallSize> calls,
                                   Function<LeadingIds, int[]> ids) {
        int n = prefixes.size();
        List<SharedPrefixes.Sequence> sequences = new ArrayList<>(n);
        int[] depths = new int[n];
        double[] weights = new double[n];
        for (int i = 0; i < n; i++) {
            Prefix prefix = prefixes.get(i);
            int[] leading = ids.apply(prefix.leading());
            sequences.add(new SharedPrefixes.Sequence(prefix.leading().head(), leading));
            CallSize call = calls.get(i);
            // The prefix's tools and framing stand before its text: the text must match from there on,
            // as deep in counted ids as the cacheable part reaches in the target's (scaled) tokens.
            int text = Math.min(target.scaled(leading.length), call.staticPrefixTokens());
            int beforeText = call.staticPrefixTokens() - text;
            int cachedText = Math.max(0, cache.cacheable(call.staticPrefixTokens()) - beforeText);
            depths[i] = text == 0 ? 0 : (int) Math.min(leading.length, (long) cachedText * leading.length / text);
            weights[i] = prefix.traffic().callsPerDay().orElse(0);
        }
        return SharedPrefixes.pooled(sequences, depths, weights);
    }

    /** The monthly cost without the cache less the expected monthly cost with it. */
    private static OptionalDouble saving(Footprint footprint) {
        if (footprint.costPerMonth().isEmpty() || footprint.costPerMonthUncached().isEmpty()) {
            return OptionalDouble.empty();
        }
        return OptionalDouble.of(footprint.costPerMonthUncached().getAsDouble() - footprint.costPerMonth().getAsDouble());
    }
}

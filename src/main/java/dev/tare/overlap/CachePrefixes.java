package dev.tare.overlap;

import dev.tare.footprint.CallSize;
import dev.tare.footprint.Footprint;
import dev.tare.footprint.Footprints;
import dev.tare.footprint.Target;
import dev.tare.template.Renderer;
import dev.tare.template.Rendering;
import dev.tare.template.Template;
import dev.tare.tokenize.Tokenizer;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.OptionalDouble;

/**
 * Prefix caching across the templates of a repository: per target with a prefix cache, the leading
 * static tokens each template shares with another (design.md, "Formulas": cached input tokens), as
 * the templates stand and as they would be with every template's per-call parts after its static
 * parts, and what caching them saves per month. The leading token ids of each template are taken
 * once ({@link #leading}); {@link #share} then compares all of them at once, sorted, in
 * n log n comparisons rather than one per pair.
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
     * @param now       the ids of the text before the first per-call part
     * @param reordered the ids of the reordered text (the same array when the template has no variable)
     */
    public record LeadingIds(int[] now, int[] reordered) {
        /** Leading ids of a template that takes no part in prefix sharing (a partial or a tool file). */
        public static final LeadingIds NONE = new LeadingIds(new int[0], new int[0]);
    }

    /** The leading texts of {@code template}, rendered once and shared by every target. */
    public static Texts texts(Template template, Renderer renderer, Rendering samples) {
        List<String> now = StaticPrefix.of(template, renderer, samples);
        List<String> reordered = samples.variables().isEmpty() ? now : StaticPrefix.reordered(template, renderer);
        return new Texts(now, reordered);
    }

    /** The leading token ids of {@code texts} on {@code tokenizer}. */
    public static LeadingIds leading(Texts texts, Tokenizer tokenizer) {
        int[] now = ids(tokenizer, texts.now());
        int[] reordered = texts.reordered().equals(texts.now()) ? now : ids(tokenizer, texts.reordered());
        return new LeadingIds(now, reordered);
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
     * How each template's leading tokens are shared on {@code target}, which must have a prefix
     * cache.
     *
     * @param leading each template's leading ids on the target's tokenizer, in any order
     * @param calls   each template's call on the target, in the same order, without cached tokens
     * @return one share per template, in the same order
     */
    public static List<PrefixShare> share(Target target, List<LeadingIds> leading, List<CallSize> calls) {
        int minimum = target.prefixCacheMinTokens().orElseThrow(
                () -> new IllegalArgumentException("target " + target.name() + " has no prefix cache"));
        int[] now = SharedPrefixes.lengths(leading.stream().map(LeadingIds::now).toList());
        int[] reordered = SharedPrefixes.lengths(leading.stream().map(LeadingIds::reordered).toList());
        List<PrefixShare> shares = new ArrayList<>(leading.size());
        for (int i = 0; i < leading.size(); i++) {
            CallSize call = calls.get(i);
            int cached = cached(now[i], minimum, call);
            int cachedReordered = cached(reordered[i], minimum, call);
            Footprint uncached = Footprints.estimate(target, withShared(call, 0));
            shares.add(new PrefixShare(now[i], cached, reordered[i], cachedReordered,
                    saving(target, uncached, call, cached), saving(target, uncached, call, cachedReordered)));
        }
        return shares;
    }

    /** The cached tokens of a shared run: all of it from the cache's minimum on, none below, never more than the call. */
    private static int cached(int shared, int minimum, CallSize call) {
        int within = Math.min(shared, call.inputTokens());
        return within > 0 && within >= minimum ? within : 0;
    }

    /** The monthly cost without the cache less the monthly cost with {@code cached} tokens cached. */
    private static OptionalDouble saving(Target target, Footprint uncached, CallSize call, int cached) {
        if (uncached.costPerMonth().isEmpty()) {
            return OptionalDouble.empty();
        }
        Footprint withCache = Footprints.estimate(target, withShared(call, cached));
        return OptionalDouble.of(uncached.costPerMonth().getAsDouble() - withCache.costPerMonth().getAsDouble());
    }

    private static CallSize withShared(CallSize call, int shared) {
        return new CallSize(call.inputTokens(), call.framingTokens(), call.outputTokens(), shared);
    }
}

package dev.tare.footprint;

/**
 * The numbers of a decoder-only transformer that the footprint formulas need.
 *
 * @param params         parameter count (P)
 * @param layers         transformer layers (L)
 * @param heads          attention (query) heads (H)
 * @param kvHeads        key/value heads (Hkv); equal to {@code heads} without grouped-query attention
 * @param headDim        size of one attention head (D)
 * @param origin         where the shape came from, shown to users: a catalog name, a config file, inline
 * @param paramsComputed whether {@code params} was computed from the shape rather than stated by a source
 */
public record ModelShape(double params, int layers, int heads, int kvHeads, int headDim, String origin,
                         boolean paramsComputed) {

    /** The attention width H × D (d_attn in Kaplan et al. 2020). */
    public long attentionWidth() {
        return (long) heads * headDim;
    }
}

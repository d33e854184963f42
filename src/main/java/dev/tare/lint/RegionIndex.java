package dev.tare.lint;

import java.util.ArrayList;
import java.util.List;

/**
 * Regions sorted by start, with the largest end seen so far at each position, so whether a range
 * touches any region is a binary search rather than a walk over every region before it: rules ask
 * once per line, run or sentence, and a long text can hold many thousands of regions.
 */
final class RegionIndex {
    private final List<Region> regions;
    private final int[] starts;
    /** {@code maxEnds[i]} is the largest end among {@code regions[0..i]}; never decreases. */
    private final int[] maxEnds;

    /** @param regions sorted by start */
    RegionIndex(List<Region> regions) {
        this.regions = List.copyOf(regions);
        this.starts = new int[regions.size()];
        this.maxEnds = new int[regions.size()];
        int maxEnd = Integer.MIN_VALUE;
        for (int i = 0; i < regions.size(); i++) {
            starts[i] = regions.get(i).start();
            maxEnd = Math.max(maxEnd, regions.get(i).end());
            maxEnds[i] = maxEnd;
        }
    }

    /**
     * Whether some region {@link Region#overlaps overlaps} {@code [from, to)}: one that starts before
     * {@code to} (before {@code from}, for an insertion point) and ends after {@code from}.
     */
    boolean overlaps(int from, int to) {
        int before = firstStartAtOrAfter(from == to ? from : to);
        return before > 0 && maxEnds[before - 1] > from;
    }

    /** The regions that overlap {@code [from, to)}, in order. */
    List<Region> touching(int from, int to) {
        List<Region> found = new ArrayList<>();
        int end = firstStartAtOrAfter(from == to ? from : to);
        for (int i = firstMaxEndAfter(from); i < end; i++) {
            if (regions.get(i).overlaps(from, to)) {
                found.add(regions.get(i));
            }
        }
        return found;
    }

    private int firstStartAtOrAfter(int offset) {
        int low = 0;
        int high = starts.length;
        while (low < high) {
            int mid = (low + high) >>> 1;
            if (starts[mid] < offset) {
                low = mid + 1;
            } else {
                high = mid;
            }
        }
        return low;
    }

    private int firstMaxEndAfter(int offset) {
        int low = 0;
        int high = maxEnds.length;
        while (low < high) {
            int mid = (low + high) >>> 1;
            if (maxEnds[mid] <= offset) {
                low = mid + 1;
            } else {
                high = mid;
            }
        }
        return low;
    }
}

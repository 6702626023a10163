package org.ringsweep.runner.store;

import java.util.Arrays;

/**
 * The finished points of one net file, for {@code --resume}: a sorted array of 64-bit hashes of
 * their point keys (8 bytes a point, so a million finished points take 8 MB rather than the
 * 100–200 MB their key strings would), with every match confirmed by the store's
 * {@code UNIQUE (net_hash, point_key)} index. A key that is not finished is told by the array
 * alone; one that is, by one indexed look-up. The answer is exact: a hash collision costs a
 * look-up, never a skipped point.
 */
public final class FinishedPoints {
    private final String netHash;
    private final long[] sorted;
    private final ResultStore store;

    FinishedPoints(String netHash, long[] hashes, ResultStore store) {
        this.netHash = netHash;
        this.sorted = hashes;
        Arrays.sort(this.sorted);
        this.store = store;
    }

    /** How many finished points it holds. */
    public int size() {
        return sorted.length;
    }

    /** Whether the point with this key is finished (was in the store when this was taken, and still is). */
    public boolean contains(String pointKey) {
        return Arrays.binarySearch(sorted, hash(pointKey)) >= 0 && store.has(netHash, pointKey);
    }

    /** 64-bit FNV-1a over the UTF-16 code units, then the SplitMix64 finaliser to spread the bits. */
    static long hash(String key) {
        long h = 0xcbf29ce484222325L;
        for (int i = 0; i < key.length(); i++) {
            h ^= key.charAt(i);
            h *= 0x100000001b3L;
        }
        h ^= h >>> 30;
        h *= 0xbf58476d1ce4e5b9L;
        h ^= h >>> 27;
        h *= 0x94d049bb133111ebL;
        return h ^ (h >>> 31);
    }
}

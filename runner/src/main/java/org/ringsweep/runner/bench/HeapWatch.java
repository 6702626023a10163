package org.ringsweep.runner.bench;

import com.sun.management.GarbageCollectionNotificationInfo;
import java.lang.management.GarbageCollectorMXBean;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.lang.management.MemoryUsage;
import java.util.Map;
import java.util.concurrent.atomic.AtomicLong;
import javax.management.NotificationEmitter;
import javax.management.openmbean.CompositeData;

/**
 * The heap a run needed, from the JVM's own garbage-collector beans: the largest heap in use
 * right after any collection (the live set plus what the collector chose to keep: the figure
 * that must fit under {@code -Xmx}) and the peak use of the heap pools (garbage included).
 */
public final class HeapWatch {
    private final AtomicLong maxAfterGc = new AtomicLong();

    private HeapWatch() {
    }

    /** Starts watching every collection of this JVM from now on. */
    public static HeapWatch start() {
        HeapWatch w = new HeapWatch();
        for (GarbageCollectorMXBean gc : ManagementFactory.getGarbageCollectorMXBeans()) {
            if (gc instanceof NotificationEmitter emitter) {
                emitter.addNotificationListener((n, handback) -> {
                    if (GarbageCollectionNotificationInfo.GARBAGE_COLLECTION_NOTIFICATION.equals(n.getType())) {
                        Map<String, MemoryUsage> after = GarbageCollectionNotificationInfo.from((CompositeData) n.getUserData())
                                .getGcInfo().getMemoryUsageAfterGc();
                        long used = 0;
                        for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
                            MemoryUsage u = after.get(pool.getName());
                            if (pool.getType() == MemoryType.HEAP && u != null) {
                                used += u.getUsed();
                            }
                        }
                        w.maxAfterGc.accumulateAndGet(used, Math::max);
                    }
                }, null, null);
            }
        }
        return w;
    }

    /** The largest heap in use right after a collection so far (bytes). */
    public long maxAfterGcBytes() {
        return maxAfterGc.get();
    }

    /** The sum of the heap pools' peak use since the JVM started (bytes; garbage included). */
    public static long peakUsedBytes() {
        long peak = 0;
        for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
            if (pool.getType() == MemoryType.HEAP) {
                peak += pool.getPeakUsage().getUsed();
            }
        }
        return peak;
    }
}

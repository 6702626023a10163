package org.ringsweep.runner.raw;

import java.io.EOFException;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;

/**
 * Random access to the bytes of an open file: small files are read onto the heap, larger ones
 * memory-mapped once, files over 2 GiB mapped piece by piece on demand.
 */
final class FileBytes {
    /** Files up to this size are read rather than mapped: mapping costs more for them. */
    private static final long READ_LIMIT = 1 << 20;

    private final FileChannel channel;
    private final long size;
    /** The whole file, or null when it is too large for one buffer. */
    private final ByteBuffer whole;

    private FileBytes(FileChannel channel, long size, ByteBuffer whole) {
        this.channel = channel;
        this.size = size;
        this.whole = whole;
    }

    /** Captures the channel's current size; the channel must stay open while slices are taken. */
    static FileBytes of(FileChannel channel) throws IOException {
        long size = channel.size();
        if (size <= READ_LIMIT) {
            ByteBuffer buffer = ByteBuffer.allocate((int) size);
            while (buffer.hasRemaining()) {
                if (channel.read(buffer, buffer.position()) < 0) {
                    throw new EOFException("file shrank while being read");
                }
            }
            return new FileBytes(channel, size, buffer.clear());
        }
        if (size <= Integer.MAX_VALUE) {
            return new FileBytes(channel, size, channel.map(FileChannel.MapMode.READ_ONLY, 0, size));
        }
        return new FileBytes(channel, size, null);
    }

    /** Maps every slice on demand, as for files over 2 GiB; for tests of that path on small files. */
    static FileBytes mappedOnDemand(FileChannel channel) throws IOException {
        return new FileBytes(channel, channel.size(), null);
    }

    /** File size (bytes). */
    long size() {
        return size;
    }

    /** A little-endian view of {@code length} bytes from {@code offset}; the caller keeps it in range. */
    ByteBuffer slice(long offset, int length) throws IOException {
        ByteBuffer view = whole != null
                ? whole.slice((int) offset, length)
                : channel.map(FileChannel.MapMode.READ_ONLY, offset, length);
        return view.order(ByteOrder.LITTLE_ENDIAN);
    }
}

package org.ringsweep.runner.check;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import org.ringsweep.runner.results.ResultJson;
import org.ringsweep.runner.results.ResultRecord;

/**
 * {@code results.jsonl} under the output folder: one record per line, each flushed as soon as
 * its point finishes so that an interrupted run keeps what it computed. Single writer.
 */
public final class ResultsFile implements AutoCloseable {
    private final BufferedWriter writer;

    private ResultsFile(BufferedWriter writer) {
        this.writer = writer;
    }

    /** Opens (truncating) {@code OUT/results.jsonl}. */
    public static ResultsFile create(Path outDir) {
        try {
            Files.createDirectories(outDir);
            return new ResultsFile(Files.newBufferedWriter(outDir.resolve("results.jsonl"), StandardCharsets.UTF_8,
                    StandardOpenOption.CREATE, StandardOpenOption.TRUNCATE_EXISTING, StandardOpenOption.WRITE));
        } catch (IOException e) {
            throw new UncheckedIOException("cannot create " + outDir.resolve("results.jsonl") + ": " + e.getMessage(), e);
        }
    }

    /** Appends one record and flushes it. */
    public synchronized void append(ResultRecord r) {
        try {
            writer.write(ResultJson.line(r));
            writer.write('\n');
            writer.flush();
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write results.jsonl: " + e.getMessage(), e);
        }
    }

    @Override
    public void close() {
        try {
            writer.close();
        } catch (IOException e) {
            throw new UncheckedIOException("cannot close results.jsonl: " + e.getMessage(), e);
        }
    }
}

package org.ringsweep.runner.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.time.Duration;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.function.Supplier;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The ticker parser and the stall clock, on text written by the test. The ticker format is that
 * of ngspice 39's standard error (reference ngspice.md §1: the {@code Reference value : …}
 * progress ticker goes to stderr), tokens {@code " Reference value :  1.04814e-08\r"} as found in
 * the stderr file of a run of {@code engine/stall-1ff.cir}.
 */
class StallWatchTests {
    private static final double STOP = 4.12e-8;
    private static final long SECOND = 1_000_000_000L;
    private static final Supplier<Optional<Duration>> NO_CPU_TIME = Optional::empty;

    @TempDir
    Path dir;
    Path stderr;
    Path raw;
    StallWatch watch;

    @BeforeEach
    void watchAnEmptyLog() throws IOException {
        stderr = dir.resolve("point.stderr.txt");
        raw = dir.resolve("out.raw");
        Files.writeString(stderr, "");
        watch = new StallWatch(stderr, raw, STOP, Duration.ofSeconds(2));
    }

    static String token(String value) {
        return " Reference value :  " + value + "\r";
    }

    void print(String text) throws IOException {
        Files.writeString(stderr, text, StandardCharsets.UTF_8, StandardOpenOption.APPEND);
    }

    @Test
    void lastCompleteTokenGivesTheSimulatedTime() {
        String text = token("1.04714e-08") + token("1.04814e-08") + token("1.04914e-08");
        assertEquals(OptionalDouble.of(1.04914e-8), StallWatch.lastReferenceValue(text));
    }

    @Test
    void tokenStillBeingWrittenAtTheEndDoesNotCount() {
        // The number may be cut anywhere until its carriage return is written.
        String text = token("1.04814e-08") + " Reference value :  1.04";
        assertEquals(OptionalDouble.of(1.04814e-8), StallWatch.lastReferenceValue(text));
        assertEquals(OptionalDouble.of(1.04814e-8),
                StallWatch.lastReferenceValue(token("1.04814e-08") + " Reference value :  1.04914e-0"));
    }

    @Test
    void tokenCutOffAtTheStartOfTheTailDoesNotCount() {
        assertEquals(OptionalDouble.empty(), StallWatch.lastReferenceValue("ence value :  1.04914e-08\r"));
        assertEquals(OptionalDouble.empty(), StallWatch.lastReferenceValue("914e-08\r Reference val"));
        assertEquals(OptionalDouble.of(2.5e-9),
                StallWatch.lastReferenceValue("4e-08\r" + token("2.50000e-09") + " Refer"));
    }

    @Test
    void tokenFollowedByALineBreakAndOtherMessagesCounts() {
        String text = "Note: Starting dynamic gmin stepping\n" + token("3.00000e-09")
                + " Reference value :  3.10000e-09\nWarning: something\ndoAnalyses: TRAN:  Timestep too small\n";
        assertEquals(OptionalDouble.of(3.1e-9), StallWatch.lastReferenceValue(text));
    }

    @Test
    void textWithoutTickerGivesNothing() {
        assertEquals(OptionalDouble.empty(), StallWatch.lastReferenceValue(""));
        assertEquals(OptionalDouble.empty(), StallWatch.lastReferenceValue("Circuit: MATCHED_SERIES\n\nDoing analysis at TEMP = 27\n"));
        assertEquals(OptionalDouble.empty(), StallWatch.lastReferenceValue(" Reference value :  nan\r"));
    }

    @Test
    void clockDoesNotRunBeforeTheFirstTimePoint() throws IOException {
        print("Note: operating point\n");
        assertEquals(Optional.empty(), watch.check(0, NO_CPU_TIME));
        assertEquals(Optional.empty(), watch.check(100 * SECOND, NO_CPU_TIME));
        print(token("1.04814e-08"));
        assertEquals(Optional.empty(), watch.check(101 * SECOND, NO_CPU_TIME));
        // The stall period (2 s) counts from the first time point at 101 s, not from the start.
        assertEquals(Optional.empty(), watch.check(102 * SECOND, NO_CPU_TIME));
        Optional<StallWatch.Stall> stall = watch.check(103 * SECOND, NO_CPU_TIME);
        assertTrue(stall.isPresent());
        assertEquals(1.04814e-8, stall.get().simulatedTime());
        assertEquals(Duration.ofSeconds(2), stall.get().withoutProgress());
    }

    @Test
    void creepingByLessThanAThousandthOfTheStopTimeIsNoProgress() throws IOException {
        // In the collapse of stall-1ff.cir the ticker creeps by 1e-11 s, a quarter of 0.1 % of 41.2 ns.
        print(token("1.04714e-08"));
        watch.check(0, NO_CPU_TIME);
        print(token("1.04814e-08"));
        assertEquals(Optional.empty(), watch.check(SECOND, NO_CPU_TIME));
        print(token("1.04914e-08"));
        Optional<StallWatch.Stall> stall = watch.check(2 * SECOND, NO_CPU_TIME);
        assertEquals(1.04914e-8, stall.orElseThrow().simulatedTime());
    }

    @Test
    void risingByAThousandthOfTheStopTimeRestartsTheClock() throws IOException {
        print(token("1.00000e-08"));
        watch.check(0, NO_CPU_TIME);
        print(token("1.00500e-08")); // +50 ps: more than 0.1 % of 41.2 ns (41.2 ps)
        assertEquals(Optional.empty(), watch.check(SECOND + SECOND / 2, NO_CPU_TIME));
        assertEquals(Optional.empty(), watch.check(3 * SECOND, NO_CPU_TIME));
        assertTrue(watch.check(SECOND + SECOND / 2 + 2 * SECOND, NO_CPU_TIME).isPresent());
    }

    @Test
    void tickerAtTheStopTimeEndsTheWatch() throws IOException {
        print(token("4.12000e-08"));
        assertEquals(Optional.empty(), watch.check(0, NO_CPU_TIME));
        assertEquals(Optional.empty(), watch.check(60 * SECOND, NO_CPU_TIME));
    }

    @Test
    void rawFileOnDiskEndsTheWatch() throws IOException {
        // The deck writes its raw file right after `run` (ngspice.md §2): writing a big one may take seconds.
        print(token("3.90000e-08"));
        watch.check(0, NO_CPU_TIME);
        Files.writeString(raw, "Title: partly written");
        assertEquals(Optional.empty(), watch.check(60 * SECOND, NO_CPU_TIME));
    }

    @Test
    void runWithoutCpuTimeIsStarvedNotStalled() throws IOException {
        Duration[] cpu = {Duration.ofMillis(300)};
        Supplier<Optional<Duration>> cpuTime = () -> Optional.of(cpu[0]);
        print(token("1.04814e-08"));
        watch.check(0, cpuTime);
        cpu[0] = Duration.ofMillis(900); // 0.6 s of CPU in 3 s: less than half the 2 s stall period
        assertEquals(Optional.empty(), watch.check(3 * SECOND, cpuTime));
        cpu[0] = Duration.ofMillis(1400); // 1.1 s of CPU without progress: more than half
        assertTrue(watch.check(4 * SECOND, cpuTime).isPresent());
    }

    @Test
    void missingLogIsNoStall() throws IOException {
        Files.delete(stderr);
        assertEquals(Optional.empty(), watch.check(0, NO_CPU_TIME));
        assertEquals(Optional.empty(), watch.check(60 * SECOND, NO_CPU_TIME));
    }

    @Test
    void onlyTheTailOfABigLogIsRead() throws IOException {
        // An old token far from the end is outside the tail: the clock starts with the last one only.
        print(token("1.00000e-09") + "x".repeat(10 * StallWatch.TAIL_BYTES) + "\n");
        assertEquals(Optional.empty(), watch.check(0, NO_CPU_TIME));
        assertEquals(Optional.empty(), watch.check(60 * SECOND, NO_CPU_TIME));
        print(token("2.00000e-09"));
        watch.check(61 * SECOND, NO_CPU_TIME);
        assertEquals(2e-9, watch.check(63 * SECOND, NO_CPU_TIME).orElseThrow().simulatedTime());
    }
}

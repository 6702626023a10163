package org.ringsweep.runner.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.testing.Ngspice;

/**
 * A net file whose names try to smuggle simulator commands into the deck (ngspice.md §8: shell,
 * .include, .control, output redirection, comments, continuation lines, ../ paths) is simulated
 * end to end: the deck holds none of it as a command, and nothing is written outside --out.
 */
class InjectionEndToEndTests {
    @TempDir
    Path work;

    @Test
    void craftedNamesRunNothingAndWriteNothingOutsideTheOutputFolder() throws IOException {
        Ngspice.require();
        Path sentinel = work.resolve("pwned");
        Path out = work.resolve("out");
        // The net name is free text (formats.md), so it carries whole lines of deck and control syntax.
        String evil = "\"X\\n.control\\nshell touch " + sentinel + "\\nquit\\n.endc\\n* ; $ `touch " + sentinel + "` ../../escape\"";
        // Point, id and corner names may not hold blanks, `/` or `=` (paths use them), but everything else.
        String drv = "\"U1.1;.include;`touch_" + sentinel.getFileName() + "`\"";
        String rcv = "\"..U2;1$shell>pwned\"";
        String junction = "\"*J1+.control\"";
        String net = "format: ringsweep/net-1\n"
                + "net: " + evil + "\n"
                + "rails: { VCC: 3.3 }\n"
                + "drivers:\n  - { pin: " + drv + ", model: ramp, v_high: VCC, rise: 1ns, r_out: 20 }\n"
                + "receivers:\n  - { pin: " + rcv + ", model: cmos, c_in: 2pF, vih: 2.0, vil: 0.8 }\n"
                + "segments:\n  - { id: \"TL1;.endc\", from: " + drv + ", to: " + junction + ", z0: 50, delay: 1ns }\n"
                + "  - { from: " + junction + ", to: " + rcv + ", z0: 50, delay: 0.5ns }\n"
                + "corners:\n  \"..;shell\": { \"U1.1;.include;`touch_" + sentinel.getFileName() + "`/rise\": 2ns }\n";
        Path netFile = work.resolve("evil.yaml");
        Files.writeString(netFile, net);
        CliRun run = CliRun.of("check", "--corners", "--out", out.toString(), netFile.toString());
        assertTrue(run.exitCode() == 0 || run.exitCode() == 1, () -> run.exitCode() + "\n" + run.err() + run.out());
        assertFalse(Files.exists(sentinel), "a shell command from user text ran");
        List<Path> written;
        try (Stream<Path> s = Files.walk(work)) {
            written = s.filter(Files::isRegularFile).toList();
        }
        for (Path p : written) {
            assertTrue(p.equals(netFile) || p.startsWith(out), "written outside --out: " + p);
        }
        List<Path> decks = written.stream().filter(p -> p.toString().endsWith(".cir")).toList();
        assertEquals(2, decks.size(), written.toString());
        for (Path deck : decks) {
            String text = Files.readString(deck);
            for (String line : text.split("\n")) {
                if (line.startsWith("*")) {
                    continue; // comment lines carry the escaped names for humans
                }
                String lower = line.toLowerCase(java.util.Locale.ROOT);
                assertFalse(lower.startsWith("shell") || lower.contains(" shell ") || lower.contains("`"), line);
                assertFalse(lower.contains(".include"), line);
                assertFalse(lower.contains(".endc") && !lower.equals(".endc"), line);
            }
            assertEquals(1, text.split("\n\\.control", -1).length - 1, "exactly our one .control block:\n" + text);
            for (String line : text.split("\n")) {
                assertFalse(line.startsWith("+"), "no continuation line from user text: " + line);
                assertFalse(line.contains(">"), "no redirection: " + line);
            }
        }
    }
}

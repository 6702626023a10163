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
        String evil = "\"X\\n.control\\nshell touch " + sentinel + "\\nquit\\n.endc\\n* ; $ `touch " + sentinel + "` ../../escape\"";
        String net = "format: ringsweep/net-1\n"
                + "net: " + evil + "\n"
                + "rails: { VCC: 3.3 }\n"
                + "drivers:\n  - { pin: \"U1.1\\n.include /etc/passwd\", model: ramp, v_high: VCC, rise: 1ns, r_out: 20 }\n"
                + "receivers:\n  - { pin: \"../../U2;1 shell rm\", model: cmos, c_in: 2pF, vih: 2.0, vil: 0.8 }\n"
                + "segments:\n  - { id: \"TL1\\n+ .control\", from: \"U1.1\\n.include /etc/passwd\", to: \"J*1 > " + sentinel + "\", z0: 50, delay: 1ns }\n"
                + "  - { from: \"J*1 > " + sentinel + "\", to: \"../../U2;1 shell rm\", z0: 50, delay: 0.5ns }\n"
                + "corners:\n  \"../../slow\\nshell id\": { \"U1.1\\n.include /etc/passwd/rise\": 2ns }\n";
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
            assertFalse(text.contains("shell"), text);
            assertFalse(text.toLowerCase(java.util.Locale.ROOT).contains(".include"), text);
            assertFalse(text.contains("/etc/passwd"), text);
            assertEquals(1, text.split("\n\\.control", -1).length - 1, "exactly our one .control block:\n" + text);
            for (String line : text.split("\n")) {
                assertFalse(line.startsWith("+"), "no continuation line from user text: " + line);
                assertFalse(line.contains(">"), "no redirection: " + line);
            }
        }
    }
}

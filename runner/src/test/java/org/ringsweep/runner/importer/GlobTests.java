package org.ringsweep.runner.importer;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** Board-file patterns: shell-style `*` and `?` over the whole name (common practice), case-insensitive. */
class GlobTests {
    @Test
    void starAndQuestionMarkMatchLikeShellPatterns() {
        assertTrue(new Glob("U1.1?").matches("U1.14"));
        assertFalse(new Glob("U1.1?").matches("U1.140"));
        assertFalse(new Glob("U1.1?").matches("U1.2"));
        assertTrue(new Glob("SPI0_*").matches("SPI0_SCK"));
        assertFalse(new Glob("SPI0_*").matches("XSPI0_SCK"));
    }

    @Test
    void dotsAndOtherCharactersAreLiteralAndCaseIsIgnored() {
        assertFalse(new Glob("U1.*").matches("U1x14"));
        assertTrue(new Glob("U1.*").matches("u1.14"));
        assertTrue(new Glob("VDD[1]").matches("VDD[1]"));
    }
}

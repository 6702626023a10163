package org.ringsweep.generators.deck;

import java.util.regex.Pattern;

/**
 * How to write one deck.
 *
 * @param rawFileName  the raw file the deck's {@code write} command creates, relative to the
 *                     directory ngspice runs in; must match {@code [a-z0-9_]+\.raw}
 * @param binary       binary raw file ({@code set filetype=binary}), else ASCII
 * @param conservative the retry settings for a run that failed to converge:
 *                     {@code .options method=gear reltol=1e-4} and a maximum time step a quarter
 *                     of the circuit's (gear damps the numerical ringing of the trapezoidal rule
 *                     on ideal edges; ngspice.md §5)
 */
public record DeckOptions(String rawFileName, boolean binary, boolean conservative) {
    private static final Pattern RAW = Pattern.compile("[a-z0-9_]+\\.raw");

    /** Validates the raw file name. */
    public DeckOptions {
        if (rawFileName == null || !RAW.matcher(rawFileName).matches()) {
            throw new IllegalArgumentException("raw file name `" + rawFileName + "` must match " + RAW.pattern());
        }
    }

    /** Binary raw file {@code rawFileName}, normal settings. */
    public static DeckOptions of(String rawFileName) {
        return new DeckOptions(rawFileName, true, false);
    }
}

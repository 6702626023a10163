package org.ringsweep.generators.deck;

import java.util.List;
import java.util.regex.Pattern;
import org.ringsweep.api.circuit.SafeName;

/**
 * One point of a batch master deck ({@link DeckWriter#renderBatch}): the circuit-only deck the
 * master sources, the raw file it writes and the probed nodes.
 *
 * @param deckFileName the circuit-only deck ({@link DeckWriter#renderCircuitOnly}), relative to
 *                     the folder ngspice runs in; must match {@code [a-z0-9_]+\.cir}
 * @param rawFileName  the raw file to write, relative to the same folder; must match
 *                     {@code [a-z0-9_]+\.raw}
 * @param probes       the safe names of the probed nodes, written as {@code v(<name>)}; at least one
 */
public record BatchEntry(String deckFileName, String rawFileName, List<String> probes) {
    private static final Pattern DECK = Pattern.compile("[a-z0-9_]+\\.cir");
    private static final Pattern RAW = Pattern.compile("[a-z0-9_]+\\.raw");

    /**
     * Validates the names and copies the probes.
     *
     * @throws IllegalArgumentException for a file name outside its pattern, no probes or a probe that is not a safe name
     */
    public BatchEntry {
        if (deckFileName == null || !DECK.matcher(deckFileName).matches()) {
            throw new IllegalArgumentException("batch deck name `" + deckFileName + "` must match " + DECK.pattern());
        }
        if (rawFileName == null || !RAW.matcher(rawFileName).matches()) {
            throw new IllegalArgumentException("batch raw file name `" + rawFileName + "` must match " + RAW.pattern());
        }
        probes = List.copyOf(probes);
        if (probes.isEmpty()) {
            throw new IllegalArgumentException("batch entry " + deckFileName + " has no probes");
        }
        probes.forEach(p -> SafeName.require(p, "probe"));
    }
}

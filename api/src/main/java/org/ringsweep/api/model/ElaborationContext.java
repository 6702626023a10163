package org.ringsweep.api.model;

import java.util.List;
import org.apiguardian.api.API;
import org.ringsweep.api.circuit.Primitive;

/**
 * What a driver or receiver model sees while it turns its element into circuit primitives. The
 * host owns naming: every node and element name a model uses must come from {@link #pinNode()},
 * {@link #railNode(String)}, {@link #groundNode()}, {@link #newNode(String)} or
 * {@link #newName(String)}, so user text never reaches a deck.
 *
 * <p>Not thread-safe; valid only during the one {@code elaborate} call it is passed to.
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public interface ElaborationContext {
    /** The safe node of the element's pin. */
    String pinNode();

    /** The ground node ({@code 0}). */
    String groundNode();

    /** The net's rails (V) by the user's names. */
    NetRails rails();

    /**
     * The safe node of a declared rail (GND gives the ground node). The host drives each rail node
     * with its DC source.
     *
     * @throws ModelParameterException if the rail is not declared
     */
    String railNode(String rail);

    /** The stimulus schedule: every edge, in time order. */
    List<ScheduledEdge> edges();

    /** The stop time of the transient analysis (s). */
    double stopTime();

    /**
     * A new internal node, unique in the circuit.
     *
     * @param hint a readable stem (any text; it is sanitised)
     */
    String newNode(String hint);

    /**
     * A new element name, unique in the circuit.
     *
     * @param hint a readable stem (any text; it is sanitised)
     */
    String newName(String hint);

    /** Adds a primitive to the circuit. */
    void add(Primitive primitive);

    /** Records a warning for the user (one line, plain text). */
    void warn(String message);
}

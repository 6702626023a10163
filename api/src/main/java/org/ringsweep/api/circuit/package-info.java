/**
 * A flat circuit: primitives on named nodes, plus the transient analysis to run. This is what
 * every engine consumes, so ngspice and an in-process solver can be compared on the same
 * input. Node and element names are already safe identifiers ({@link org.ringsweep.api.circuit.SafeName}).
 *
 * <p>Tier: public.
 */
package org.ringsweep.api.circuit;

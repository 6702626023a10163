package org.ringsweep.generators.elaborate;

/**
 * A receiver as the measurements see it.
 *
 * @param pin      the receiver pin as the user wrote it ({@code U7.6})
 * @param node     its safe node in the circuit
 * @param vil      input low threshold (V)
 * @param vih      input high threshold (V)
 * @param lowRail  the low rail for undershoot (V): the first driver's v_low
 * @param highRail the high rail for overshoot (V): the receiver's {@code supply} rail when given,
 *                 else the first driver's v_high
 */
public record ReceiverProbe(String pin, String node, double vil, double vih, double lowRail, double highRail) {
}

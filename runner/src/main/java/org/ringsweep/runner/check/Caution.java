package org.ringsweep.runner.check;

/** The caution every report carries, because results can mislead someone into damaging hardware. */
public final class Caution {
    /** The caution, in one paragraph. */
    public static final String TEXT = "Caution: these results are only as good as the driver, receiver and line models given; "
            + "they do not replace measurement on a real board. The receivers' datasheet absolute-maximum ratings "
            + "and the applicable interface standards govern; the default limits are common practice, not a rating.";

    private Caution() {
    }
}

package org.ringsweep.api.quantity;

import org.apiguardian.api.API;

/**
 * Parses user text into SI base values. See {@code formats.md}, "Quantities".
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public final class Quantities {
    private Quantities() {
    }

    /**
     * Parses {@code text} as a quantity of the given dimension.
     *
     * @param text     user text such as {@code "2ns"}, {@code "4k7"}, {@code "1.2in"} or {@code "22"}
     * @param expected the dimension the key requires
     * @return the value in SI base units (finite)
     * @throws QuantityFormatException if the text is not a finite number of that dimension
     */
    public static double parse(String text, Dimension expected) {
        throw new UnsupportedOperationException("not yet written");
    }
}

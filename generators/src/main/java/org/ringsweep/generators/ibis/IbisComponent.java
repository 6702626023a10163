package org.ringsweep.generators.ibis;

import java.util.List;
import java.util.Optional;

/**
 * A {@code [Component]} with its manufacturer, package parasitics and pins.
 *
 * @param name         the component name
 * @param manufacturer the {@code [Manufacturer]} text, empty when absent
 * @param rPkg         package resistance (ohm), or null when {@code [Package]} is absent
 * @param lPkg         package inductance (H), or null
 * @param cPkg         package capacitance (F), or null
 * @param pins         the pins in file order
 */
public record IbisComponent(String name, String manufacturer, IbisRange rPkg, IbisRange lPkg, IbisRange cPkg,
                            List<IbisPin> pins) {
    /** Copies the pin list. */
    public IbisComponent {
        pins = List.copyOf(pins);
    }

    /** The pin with that name (exact match). */
    public Optional<IbisPin> pin(String name) {
        return pins.stream().filter(p -> p.pin().equals(name)).findFirst();
    }
}

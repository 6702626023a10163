package org.ringsweep.generators.elaborate;

import java.math.BigDecimal;
import java.util.Locale;

/** Short quantity texts for warnings. */
final class Quantities {
    private Quantities() {
    }

    /** A resistance as a part value: {@code 4.7 kΩ}, {@code 470 Ω}, {@code 1.2 MΩ} (up to 4 significant digits). */
    static String ohms(double ohms) {
        if (ohms >= 1e6) {
            return plain(ohms / 1e6) + " MΩ";
        }
        if (ohms >= 1e3) {
            return plain(ohms / 1e3) + " kΩ";
        }
        return plain(ohms) + " Ω";
    }

    /** A resistance in ohms with one decimal, as the window ends are quoted: {@code 966.7 Ω}. */
    static String ohms1(double ohms) {
        return String.format(Locale.ROOT, "%.1f Ω", ohms);
    }

    /** A capacitance in pF with one decimal: {@code 87.3 pF}. */
    static String picofarads(double farads) {
        return String.format(Locale.ROOT, "%.1f pF", farads * 1e12);
    }

    private static String plain(double x) {
        return new BigDecimal(String.format(Locale.ROOT, "%.4g", x)).stripTrailingZeros().toPlainString();
    }
}

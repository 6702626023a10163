package org.ringsweep.api.net;

import org.apiguardian.api.API;

/**
 * A path to one value of a net, written {@code ID/param}: {@code R5/value}, {@code TL2/length},
 * {@code U1.14/rise}. The id is everything before the last {@code /}.
 *
 * @param id    the element id (part ref, segment id, or driver/receiver pin)
 * @param param the parameter key
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public record ValuePath(String id, String param) implements Comparable<ValuePath> {
    /** Validates the fields. */
    public ValuePath {
        if (id == null || id.isBlank() || param == null || param.isBlank()) {
            throw new IllegalArgumentException("a path is ID/param with both parts non-empty");
        }
    }

    /**
     * Parses {@code ID/param}.
     *
     * @throws IllegalArgumentException if the text has no {@code /} or an empty part
     */
    public static ValuePath parse(String text) {
        int slash = text.lastIndexOf('/');
        if (slash <= 0 || slash == text.length() - 1) {
            throw new IllegalArgumentException("expected a path ID/param (e.g. R5/value), found `" + text + "`");
        }
        return new ValuePath(text.substring(0, slash), text.substring(slash + 1));
    }

    @Override
    public String toString() {
        return id + "/" + param;
    }

    @Override
    public int compareTo(ValuePath o) {
        return toString().compareTo(o.toString());
    }
}

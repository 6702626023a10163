package org.ringsweep.api.net;

import java.util.List;
import org.apiguardian.api.API;

/**
 * An edge of the net graph. Each element has an id unique within its kind (segment id, part
 * ref, or the pin of a driver or receiver), the points it joins, its parameters and where it was
 * written.
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public sealed interface Element permits Segment, Part, Driver, Receiver {
    /** The id a path uses ({@code TL2}, {@code R5}, {@code U1.14}). */
    String id();

    /** The points this element connects, in order. */
    List<String> points();

    /** The element's parameters. */
    Parameters parameters();

    /** A copy with other parameters. */
    Element withParameters(Parameters parameters);

    /** Where the element was written. */
    Location location();
}

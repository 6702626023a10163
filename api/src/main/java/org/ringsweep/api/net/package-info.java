/**
 * A net's topology as an immutable JGraphT graph: points (pins, junctions, rails) are vertices,
 * elements (segments, parts, drivers, receivers) are edges. Built only through
 * {@link org.ringsweep.api.net.NetBuilder}, which validates it.
 *
 * <p>Tier: public.
 */
package org.ringsweep.api.net;

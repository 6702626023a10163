package org.ringsweep.api.model;

import org.apiguardian.api.API;

/** The context a {@link DriverModel} elaborates in; {@link #pinNode()} is the driven pin. */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public interface DriverContext extends ElaborationContext {
}

package org.ringsweep.api.model;

import org.apiguardian.api.API;

/** The context a {@link ReceiverModel} elaborates in; {@link #pinNode()} is the loaded pin. */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public interface ReceiverContext extends ElaborationContext {
}

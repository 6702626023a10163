package org.ringsweep.api.model;

import java.util.List;
import java.util.Optional;
import org.apiguardian.api.API;

/** The models known to a run: built-in ones and those from plugins. */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public interface ModelCatalog {
    /** Every model, drivers first, each list by id. */
    List<ModelDescriptor> all();

    /** The model with that role and id. */
    default Optional<ModelDescriptor> find(ModelDescriptor.Role role, String id) {
        return all().stream().filter(m -> m.role() == role && m.id().equals(id)).findFirst();
    }
}

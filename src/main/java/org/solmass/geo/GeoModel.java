package org.solmass.geo;

import org.solmass.model.MassingModel;

import java.util.List;

/**
 * A model read from a file, with its geo-reference when the file has one.
 *
 * @param model the model in the Solmass frame (metres, x east, y north, z up)
 * @param reference where it stands, or null for a model in local coordinates (OBJ)
 * @param warnings what the reader found worth saying
 */
public record GeoModel(MassingModel model, GeoReference reference, List<String> warnings) {
    public GeoModel {
        warnings = List.copyOf(warnings);
    }
}

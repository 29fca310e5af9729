package org.solmass.metrics;

import org.solmass.climate.WeatherSeries;
import org.solmass.irradiation.IrradiationResult;
import org.solmass.scene.Scene;
import org.solmass.sky.SkyModel;
import org.solmass.sun.Site;
import org.solmass.surface.PatchSet;

import java.time.MonthDay;
import java.util.List;

/**
 * What a metric may read: the finished stages of one analysis and the metrics' settings.
 *
 * @param scene the BVH the metrics cast rays of their own into: the whole model's, or a city tile's
 *              (its blocks and halo, triangles numbered in its own order)
 * @param sceneIsGround per triangle of {@code scene}, in the scene's numbering: whether it belongs to a
 *                      GROUND surface ({@link org.solmass.surface.Surface#groundTriangles} for the whole
 *                      model; a tile maps the whole model's flags through its triangle list)
 * @param patches the analysed patches and their surfaces
 * @param irradiation the per-patch irradiation result
 * @param weather the weather series of the run
 * @param sky the sky model of the run
 * @param site the site (latitude, longitude, elevation, standard-time zone)
 * @param year calendar year of dated metrics (sun hours on a date)
 * @param groundAlbedo ground albedo, 0..1
 * @param patchM patch size, metres
 * @param rays hemisphere rays per patch the study asks for (metrics that sample the hemisphere use as many)
 * @param raySeed seed of the run's ray streams (with each patch's id: results do not depend on threads)
 * @param settings the metrics' own settings
 */
public record MetricContext(Scene scene, boolean[] sceneIsGround, PatchSet patches, IrradiationResult irradiation, WeatherSeries weather,
                            SkyModel sky, Site site, int year, double groundAlbedo, double patchM, int rays, long raySeed,
                            Settings settings) {

    public MetricContext {
        if (scene != null && (sceneIsGround == null || sceneIsGround.length != scene.triangleCount()))
            throw new IllegalArgumentException("ground flags for " + (sceneIsGround == null ? "no" : sceneIsGround.length)
                    + " triangles, the scene has " + scene.triangleCount() + ": flags must follow the scene's own numbering");
    }

    /**
     * Settings of the metrics (study keys {@code sun_hours} and {@code pv}, docs/study-file.md).
     *
     * @param sunHourDates dates of the sun-hour metric
     * @param sunHourStepMinutes time step of the sun-hour sampling, minutes
     * @param sunHourMinElevationDeg sun elevation below which the sun does not count, degrees
     * @param pv PV roof-zone settings
     */
    public record Settings(List<MonthDay> sunHourDates, int sunHourStepMinutes, double sunHourMinElevationDeg,
                           PvZones.Settings pv) {
        public Settings {
            sunHourDates = List.copyOf(sunHourDates);
        }
    }
}

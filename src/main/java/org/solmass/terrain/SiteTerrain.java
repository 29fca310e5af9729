package org.solmass.terrain;

import org.solmass.InputException;
import org.solmass.scene.HorizonProfile;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * The terrain of a site, ready for the scene: the DEM near the site as triangles (model coordinates)
 * and the far horizon beyond them.
 *
 * <p>Placement: model point (x, y) lies at easting {@code originEastM + x}, northing
 * {@code originNorthM + y} of the DEM's grid (the model's north taken as the grid's north: meridian
 * convergence is left out). The DEM is moved vertically so that its height at the site centre equals
 * the model's ground level. The near terrain is the DEM's cells whose centre lies within
 * {@code nearRadiusM} of the site centre, each cut into two triangles (every {@code stride}-th sample
 * when the disc holds more than {@value #MAX_CELLS} cells). The flat ground plane is kept at the
 * lowest point of this mesh, so that beyond the mesh the ground continues at its lowest level; the
 * far horizon ({@link DemHorizon}, from the site centre at the mean height of the analysed patches,
 * beyond the near radius; or from a CSV file, which wins) stands for everything further.
 *
 * @param horizon the far horizon ({@link HorizonProfile#NONE} without one)
 * @param soup terrain triangles, 9 floats each (corners x,y,z, model coordinates, metres); empty without a DEM
 * @param lowestZ lowest z of the terrain triangles (model coordinates), NaN without any
 * @param notes lines for the run's warnings and summary (what was read and how it was placed)
 */
public record SiteTerrain(HorizonProfile horizon, float[] soup, double lowestZ, List<String> notes) {
    /** Most DEM cells triangulated; coarser sampling beyond. */
    public static final int MAX_CELLS = 250_000;
    /** Azimuths of a horizon computed from the DEM (0.5 deg apart). */
    public static final int HORIZON_AZIMUTHS = 720;

    public static final SiteTerrain NONE = new SiteTerrain(HorizonProfile.NONE, new float[0], Double.NaN, List.of());

    public int triangleCount() { return soup.length / 9; }

    /**
     * @param spec the study's terrain section
     * @param siteX x of the site centre, model coordinates, metres
     * @param siteY y of the site centre
     * @param groundZ the model's ground level, metres
     * @param eyeAboveGroundM height above ground from which the DEM's far horizon is seen, metres
     */
    public static SiteTerrain build(TerrainSpec spec, double siteX, double siteY, double groundZ, double eyeAboveGroundM) {
        if (spec == null || spec.isNone()) return NONE;
        List<String> notes = new ArrayList<>();
        HorizonProfile horizon = HorizonProfile.NONE;
        if (spec.horizonCsv() != null) {
            horizon = HorizonCsv.read(spec.horizonCsv());
            notes.add(String.format(Locale.ROOT, "far horizon from %s: highest %.1f deg", spec.horizonCsv(), horizon.maxElevationDeg()));
        }
        if (spec.dem() == null) return new SiteTerrain(horizon, new float[0], Double.NaN, notes);

        Dem dem = GeoTiffDem.read(spec.dem(), spec.demEpsg(), "terrain.dem_epsg");
        double e = spec.originEastM() + siteX, n = spec.originNorthM() + siteY, r = spec.nearRadiusM();
        if (!(dem.covers(e - r, n - r) && dem.covers(e + r, n + r))) {
            throw new InputException(dem.source(), String.format(Locale.ROOT,
                    "does not cover the site: the terrain within %.0f m (terrain.near_radius_m) of the site centre E %.1f, N %.1f"
                            + " needs E %.1f..%.1f m, N %.1f..%.1f m; the DEM covers %s (check terrain.origin_east_m and origin_north_m)",
                    r, e, n, e - r, e + r, n - r, n + r, dem.extentText()));
        }
        double siteZ = dem.heightAt(e, n);
        if (Double.isNaN(siteZ)) throw nodataAt(dem, e, n, r, (int) ((e - dem.x0()) / dem.dx()), (int) ((dem.y0() - n) / dem.dy()));
        double lift = groundZ - siteZ;
        float[] soup = mesh(dem, e, n, r, spec.originEastM(), spec.originNorthM(), lift);
        double lowest = Double.POSITIVE_INFINITY;
        for (int i = 2; i < soup.length; i += 3) lowest = Math.min(lowest, soup[i]);
        notes.add(String.format(Locale.ROOT, "terrain from %s: %d x %d samples of %.1f x %.1f m, %s; %d triangles within %.0f m"
                        + " of the site centre; the site centre's DEM height %.1f m is the model's ground level %.2f m",
                dem.source(), dem.width(), dem.height(), dem.dx(), dem.dy(), dem.extentText(), soup.length / 9, r, siteZ, groundZ));
        if (spec.horizonCsv() == null && spec.farHorizonFromDem()) {
            horizon = new HorizonProfile(DemHorizon.elevationsDeg(dem, e, n, siteZ + eyeAboveGroundM, r, HORIZON_AZIMUTHS));
            notes.add(String.format(Locale.ROOT, "far horizon from the DEM beyond %.0f m: highest %.1f deg", r, horizon.maxElevationDeg()));
        }
        return new SiteTerrain(horizon, soup, soup.length == 0 ? Double.NaN : lowest, notes);
    }

    private static InputException nodataAt(Dem dem, double e, double n, double r, int col, int row) {
        return new InputException(dem.source(), String.format(Locale.ROOT,
                "nodata at the site: sample (column %d, row %d) at E %.1f, N %.1f lies within %.0f m (terrain.near_radius_m)"
                        + " of the site centre E %.1f, N %.1f; fill the hole or reduce the radius",
                col, row, dem.x(col), dem.y(row), r, e, n));
    }

    /** The DEM cells whose centre lies within r of (e, n), two triangles each, in model coordinates. */
    static float[] mesh(Dem dem, double e, double n, double r, double originE, double originN, double lift) {
        if (r <= 0) return new float[0];
        int c0 = (int) Math.floor((e - r - dem.x0()) / dem.dx()), c1 = (int) Math.ceil((e + r - dem.x0()) / dem.dx());
        int r0 = (int) Math.floor((dem.y0() - (n + r)) / dem.dy()), r1 = (int) Math.ceil((dem.y0() - (n - r)) / dem.dy());
        c0 = Math.max(0, c0); r0 = Math.max(0, r0);
        c1 = Math.min(dem.width() - 1, c1); r1 = Math.min(dem.height() - 1, r1);
        double cells = Math.PI * r * r / (dem.dx() * dem.dy());
        int stride = (int) Math.max(1, Math.ceil(Math.sqrt(cells / MAX_CELLS)));
        float[] out = new float[18 * (((c1 - c0) / stride + 1) * ((r1 - r0) / stride + 1))];
        int k = 0;
        for (int j = r0; j + stride <= r1; j += stride) {
            for (int i = c0; i + stride <= c1; i += stride) {
                double cx = dem.x(i) + stride * dem.dx() / 2, cy = dem.y(j) - stride * dem.dy() / 2;
                if (Math.hypot(cx - e, cy - n) > r) continue;
                int i1 = i + stride, j1 = j + stride;
                double zNw = dem.at(i, j), zNe = dem.at(i1, j), zSe = dem.at(i1, j1), zSw = dem.at(i, j1);
                if (Double.isNaN(zNw + zNe + zSe + zSw)) {
                    int bc = Double.isNaN(zNw) || Double.isNaN(zSw) ? i : i1, br = Double.isNaN(zNw) || Double.isNaN(zNe) ? j : j1;
                    throw nodataAt(dem, e, n, r, bc, br);
                }
                // counter-clockwise seen from above (x east, y north): SW, SE, NE and SW, NE, NW
                k = corner(out, k, dem.x(i) - originE, dem.y(j1) - originN, zSw + lift);
                k = corner(out, k, dem.x(i1) - originE, dem.y(j1) - originN, zSe + lift);
                k = corner(out, k, dem.x(i1) - originE, dem.y(j) - originN, zNe + lift);
                k = corner(out, k, dem.x(i) - originE, dem.y(j1) - originN, zSw + lift);
                k = corner(out, k, dem.x(i1) - originE, dem.y(j) - originN, zNe + lift);
                k = corner(out, k, dem.x(i) - originE, dem.y(j) - originN, zNw + lift);
            }
        }
        return java.util.Arrays.copyOf(out, k);
    }

    private static int corner(float[] out, int k, double x, double y, double z) {
        out[k] = (float) x;
        out[k + 1] = (float) y;
        out[k + 2] = (float) z;
        return k + 3;
    }
}

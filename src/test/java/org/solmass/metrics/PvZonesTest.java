package org.solmass.metrics;

import org.junit.jupiter.api.Test;
import org.solmass.climate.ClimateSource;
import org.solmass.climate.ClimateSpec;
import org.solmass.climate.WeatherSeries;
import org.solmass.model.MassingModel;
import org.solmass.sky.Perez;
import org.solmass.sky.PreparedSky;
import org.solmass.sun.Site;
import org.solmass.surface.Patch;
import org.solmass.surface.PatchOptions;
import org.solmass.surface.PatchSet;
import org.solmass.surface.Patcher;
import org.solmass.surface.SurfaceKind;

import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class PvZonesTest {
    static final BestPlane BEST = new BestPlane(35, 180, 1000);
    static final PvZones.Settings SETTINGS = new PvZones.Settings(80, 10, 0.2, 0.8);

    /** Two roofs (20 x 10 m and 6 x 6 m) patched at 1 m; suitability set by a pattern of our choosing. */
    private static PatchSet roofs() {
        MassingModel m = new Obj().block("a").box(0, 0, 20, 10, 12).block("b").box(30, 0, 36, 6, 9).model();
        return Patcher.build(m, new PatchOptions(1.0, Set.of(), false));
    }

    /**
     * Annual irradiation per patch: on roof a, two suitable rectangles x in [0, 6] and x in [10, 20]
     * split by an unsuitable band, plus one suitable patch at (8.5, 9.5) touching nothing, and a
     * diagonal pair of 1 m patches meeting only at a corner; roof b wholly suitable; walls 950 but
     * never in a zone (not roofs).
     */
    private static double[] annual(PatchSet ps) {
        double[] v = new double[ps.patchCount()];
        for (Patch p : ps.patches()) {
            double x = p.centroid().x(), y = p.centroid().y();
            boolean ok;
            if (p.kind() != SurfaceKind.ROOF) ok = true;
            else if (p.blockName().equals("b")) ok = true;
            else ok = x < 6 || x > 10 || (x > 8 && x < 9 && y > 9) || (x > 7 && x < 8 && y < 1) || (x > 8 && x < 9 && y > 1 && y < 2);
            v[p.index()] = ok ? 950 : 500;
        }
        return v;
    }

    @Test
    void zonesConserveAreaAndNoPatchIsInTwoZones() {
        PatchSet ps = roofs();
        double[] a = annual(ps);
        double[] loss = new double[a.length];
        PvZones.Result r = PvZones.compute(ps.patches(), ps.surfaces(), a, loss, 1.0, BEST, SETTINGS);
        Set<Integer> seen = new HashSet<>();
        double zoneArea = 0;
        for (PvZones.Zone z : r.zones()) {
            double sum = 0;
            for (int p : z.patches()) {
                assertTrue(seen.add(p), "patch " + p + " in two zones");
                assertEquals(z.id(), r.zoneOf()[p]);
                assertEquals(SurfaceKind.ROOF, ps.patches().get(p).kind());
                assertTrue(r.suitabilityPct()[p] >= 80);
                sum += ps.patches().get(p).areaM2();
            }
            assertEquals(sum, z.areaM2(), 1e-9);
            assertTrue(z.areaM2() >= SETTINGS.minZoneM2());
            // the outline encloses exactly the patches: union area (shoelace of the rings) = patch area sum
            assertEquals(sum, ringArea(z.outlines()), 1e-6 * sum);
            assertEquals(z.totalKwh() * 0.2 * 0.8, z.yieldKwh(), 1e-9);
            zoneArea += z.areaM2();
        }
        double inZones = 0;
        for (Patch p : ps.patches()) if (r.zoneOf()[p.index()] > 0) inZones += p.areaM2();
        assertEquals(inZones, zoneArea, 1e-9);
        for (Patch p : ps.patches()) if (!seen.contains(p.index())) assertEquals(0, r.zoneOf()[p.index()]);
    }

    @Test
    void contiguousSuitablePatchesOfOneRoofFormOneZoneAndCornersDoNotJoin() {
        PatchSet ps = roofs();
        PvZones.Result r = PvZones.compute(ps.patches(), ps.surfaces(), annual(ps), new double[ps.patchCount()], 1.0, BEST, SETTINGS);
        // roof a: rectangles 6 x 10 = 60 m2 and 10 x 10 = 100 m2; the single and corner patches are < 10 m2
        List<Double> areas = new ArrayList<>();
        for (PvZones.Zone z : r.zones()) areas.add(z.areaM2());
        assertEquals(List.of(60.0, 100.0, 36.0), areas);
        assertEquals(3, r.zones().size());
        // with no minimum area the isolated patch and the two corner-touching patches are zones of their own
        PvZones.Result all = PvZones.compute(ps.patches(), ps.surfaces(), annual(ps), new double[ps.patchCount()], 1.0, BEST,
                new PvZones.Settings(80, 0, 0.2, 0.8));
        assertEquals(6, all.zones().size());
    }

    @Test
    void suitabilityIsTheShareOfTheBestPlaneOnRoofsOnly() {
        PatchSet ps = roofs();
        double[] a = annual(ps);
        PvZones.Result r = PvZones.compute(ps.patches(), ps.surfaces(), a, new double[a.length], 1.0, BEST, SETTINGS);
        for (Patch p : ps.patches()) {
            if (p.kind() == SurfaceKind.ROOF) assertEquals(100 * a[p.index()] / 1000, r.suitabilityPct()[p.index()], 1e-12);
            else assertTrue(Double.isNaN(r.suitabilityPct()[p.index()]));
        }
    }

    /**
     * The search result is at least as good as every plane of a dense grid (tilt 0..90 by 2 deg,
     * azimuth by 5 deg), and at 51 N on a clear-sky year it faces south (common practice: the
     * annual optimum faces the equator) with a tilt between 25 and 50 deg (common practice for
     * mid-latitudes: near latitude minus 10 to 15 deg). In the southern hemisphere it faces north.
     */
    @Test
    void bestPlaneBeatsADenseGridAndFacesTheEquator() {
        for (double lat : new double[] {51, -34}) {
            Site site = new Site(lat, 10, 0, ZoneOffset.ofHours(1));
            WeatherSeries w = ClimateSource.load(site, ClimateSpec.clearSky().withStepMinutes(60));
            PreparedSky sky = PreparedSky.of(w, Perez.INSTANCE);
            BestPlane b = BestPlane.find(sky, 0.2);
            for (int t = 0; t <= 90; t += 2) for (int az = 0; az < 360; az += 5) {
                assertTrue(sky.sum(t, az, 0.2).annualKwhM2() <= b.annualKwhM2() + 1e-9, "tilt " + t + " az " + az);
            }
            double facing = lat > 0 ? 180 : 0;
            double dAz = Math.abs(((b.azimuthDeg() - facing) + 540) % 360 - 180);
            assertTrue(dAz <= 10, "azimuth " + b.azimuthDeg() + " at " + lat);
            assertTrue(b.tiltDeg() >= 25 && b.tiltDeg() <= 50, "tilt " + b.tiltDeg() + " at " + lat);
        }
    }

    private static double ringArea(List<double[]> rings) {
        // rings lie in horizontal roofs here: shoelace in x, y (the zones of this test have no holes)
        double area = 0;
        for (double[] r : rings) {
            int n = r.length / 3;
            double s = 0;
            for (int k = 0; k < n; k++) {
                int k1 = (k + 1) % n;
                s += r[3 * k] * r[3 * k1 + 1] - r[3 * k1] * r[3 * k + 1];
            }
            area += Math.abs(s / 2);
        }
        return area;
    }
}

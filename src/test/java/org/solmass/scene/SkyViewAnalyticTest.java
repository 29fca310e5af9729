package org.solmass.scene;

import org.junit.jupiter.api.Test;
import org.solmass.surface.Patch;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Sky view factors against analytic configuration factors. */
class SkyViewAnalyticTest {
    private static final long SEED = 20240601L;

    private static ViewFactors[] run(SceneFixtures f, List<Patch> patches, int rays) {
        Scene s = Scene.build(f.model(), true, 0.0);
        return SkyViewCalculator.compute(s, patches, rays, SEED, null, null);
    }

    @Test
    void unobstructedHorizontalRoofSeesTheWholeSky() {
        // an up-facing patch has no direction below its horizon, and nothing is above the roof:
        // SVF = 1 exactly (definition of the view factor; common practice)
        SceneFixtures f = new SceneFixtures().box(-500, -500, 0, 500, 500, 20);
        ViewFactors v = run(f, List.of(SceneFixtures.patch("roof", 0, 0, 20, 0, 0, 1)), 1024)[0];
        assertEquals(1.0, v.sky(), 0.0);
        assertEquals(0.0, v.ground(), 0.0);
        assertEquals(0.0, v.obstruction(), 0.0);
        assertEquals(0.0, v.skyStdError(), 0.0);
    }

    @Test
    void verticalWallInOpenFieldSeesHalfSkyHalfGround() {
        // a vertical surface with an unobstructed horizon sees sky (1 + cos 90)/2 = 0.5 and ground 0.5
        // (isotropic tilted-surface view factors, Liu and Jordan 1963; common practice). Square blocks
        // turned by 0, 17 and 30 degrees: at 0 the horizon falls on stratum borders (exact 0.5, zero
        // error), turned it cuts through strata and the estimate carries a real standard error.
        for (double turnDeg : new double[] {0, 17, 30}) {
            double c = Math.cos(Math.toRadians(turnDeg)), s = Math.sin(Math.toRadians(turnDeg));
            double[] xy = new double[8];
            double[][] sq = {{-5, -5}, {5, -5}, {5, 5}, {-5, 5}};
            for (int i = 0; i < 4; i++) {
                xy[2 * i] = c * sq[i][0] - s * sq[i][1];
                xy[2 * i + 1] = s * sq[i][0] + c * sq[i][1];
            }
            SceneFixtures f = new SceneFixtures().prism(xy, 0, 10);
            List<Patch> ps = new ArrayList<>();
            for (int i = 0; i < 8; i++) {
                double along = -4 + i, z = 1 + i;
                // east face (local x = 5), outward normal (c, s)
                ps.add(SceneFixtures.patch("e" + i, 5 * c - along * s, 5 * s + along * c, z, c, s, 0));
                // south face (local y = -5), outward normal (s, -c)
                ps.add(SceneFixtures.patch("s" + i, along * c + 5 * s, along * s - 5 * c, z, s, -c, 0));
            }
            ViewFactors[] vs = run(f, ps, HemisphereSampler.DEFAULT_RAYS);
            for (ViewFactors v : vs) {
                if (turnDeg != 0) assertTrue(v.skyStdError() > 0, v.toString());
                assertEquals(0.5, v.sky(), 3 * v.skyStdError(), "turn " + turnDeg + ": " + v);
                assertEquals(0.5, v.ground(), 3 * v.skyStdError(), "turn " + turnDeg + ": " + v); // = 1 - sky
                assertEquals(0.0, v.obstruction(), 0.0);
            }
        }
    }

    /*
     * Infinite street canyon, walls of height H, street width W (2D, Hottel's crossed-string rule:
     * F(1->2) = (sum of crossed strings - sum of uncrossed strings) / (2 L1); Modest, Radiative Heat
     * Transfer, 3rd ed., 2013, section 4.8; from memory).
     * Wall 1 (L1 = H, foot F1, top T1) to the opening (segment T1-T2, width W, T2 = top of the
     * opposite wall): the two segments share the corner
     * T1, so they form a triangle with third side F1-T2 = sqrt(H^2 + W^2), and the crossed-string rule
     * reduces to the triangle rule F(1->2) = (L1 + L2 - L3) / (2 L1) with L3 the third side F1-T2:
     *   F(wall -> opening) = (H + W - sqrt(H^2 + W^2)) / (2H) = (1 + W/H - sqrt(1 + (W/H)^2)) / 2.
     * Floor (L1 = W) to the opening (width W, height H above): crossed strings are the two diagonals,
     * 2 sqrt(W^2 + H^2); uncrossed are the two walls, 2H; so
     *   F(floor -> opening) = (2 sqrt(W^2+H^2) - 2H) / (2W) = sqrt(1 + (H/W)^2) - H/W,
     * the mean over the floor width (a view factor from a finite surface is the area mean of the point
     * factors). Everything the walls and floor see through the opening is sky.
     *
     * Finite length L instead of infinite: at mid-length each open end is a W x H window at distance
     * d = L/2; its view factor from a wall point is at most about W^2 H / (2 pi d^3) and from a floor
     * point about W H^2 / (2 pi d^3) (small-source approximation cos1 cos2 A / (pi d^2)). With
     * L = 40 max(H, W) that is below 2e-5 for both ends together: far inside the 0.01 tolerance.
     */
    @Test
    void streetCanyonMatchesCrossedStrings() {
        double w = 10;
        for (double ratio : new double[] {0.5, 1, 2}) {
            double h = ratio * w;
            double len = 40 * Math.max(h, w);
            SceneFixtures f = new SceneFixtures()
                    .box(-w / 2 - 12, -len / 2, 0, -w / 2, len / 2, h)
                    .box(w / 2, -len / 2, 0, w / 2 + 12, len / 2, h);
            int m = 20;
            List<Patch> wall = new ArrayList<>(), floor = new ArrayList<>();
            for (int i = 0; i < m; i++) {
                wall.add(SceneFixtures.patch("w" + i, -w / 2, 0, (i + 0.5) * h / m, 1, 0, 0));
                floor.add(SceneFixtures.patch("f" + i, -w / 2 + (i + 0.5) * w / m, 0, 0, 0, 0, 1));
            }
            double wallMean = mean(run(f, wall, 4096)), floorMean = mean(run(f, floor, 4096));
            double wh = w / h, hw = h / w;
            assertEquals((1 + wh - Math.sqrt(1 + wh * wh)) / 2, wallMean, 0.01, "wall, H/W = " + ratio);
            assertEquals(Math.sqrt(1 + hw * hw) - hw, floorMean, 0.01, "floor, H/W = " + ratio);
        }
    }

    /**
     * Differential horizontal element to a parallel a x b rectangle at height c with one corner
     * directly above it: Howell, A Catalog of Radiation Heat Transfer Configuration Factors, case B-3
     * (from memory: case number), with A = a/c, B = b/c.
     */
    static double cornerRectangle(double a, double b, double c) {
        double x = a / c, y = b / c;
        double sx = Math.sqrt(1 + x * x), sy = Math.sqrt(1 + y * y);
        return (x / sx * Math.atan(y / sx) + y / sy * Math.atan(x / sy)) / (2 * Math.PI);
    }

    @Test
    void courtyardFloorCentreSeesTheOpening() {
        // closed square courtyard, inner side a, height h. From the floor centre the sky is exactly the
        // opening (the a x a square at height h); it is four a/2 x a/2 rectangles each with a corner
        // above the centre, so SVF = 4 F(a/2, a/2, h). (Not 1 - 4F: 4F is the opening itself.)
        double t = 6;
        for (double[] ah : new double[][] {{20, 20}, {20, 10}, {10, 20}}) {
            double a = ah[0], h = ah[1], r = a / 2;
            SceneFixtures f = new SceneFixtures()
                    .box(-r - t, r, 0, r + t, r + t, h)     // north
                    .box(-r - t, -r - t, 0, r + t, -r, h)   // south
                    .box(r, -r, 0, r + t, r, h)             // east
                    .box(-r - t, -r, 0, -r, r, h);          // west
            ViewFactors v = run(f, List.of(SceneFixtures.patch("c", 0, 0, 0, 0, 0, 1)), 16384)[0];
            double expected = 4 * cornerRectangle(r, r, h);
            assertEquals(expected, v.sky(), 0.01, "a = " + a + ", h = " + h);
            assertEquals(0.0, v.ground(), 0.0, "an up-facing floor point cannot see the ground plane");
        }
        // sanity of the catalogue formula: an infinite rectangle (quarter plane) gives 1/4
        assertEquals(0.25, cornerRectangle(1e9, 1e9, 1), 1e-6);
    }

    private static double mean(ViewFactors[] vs) {
        double s = 0;
        for (ViewFactors v : vs) s += v.sky();
        return s / vs.length;
    }
}

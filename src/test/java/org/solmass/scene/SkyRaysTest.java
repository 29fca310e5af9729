package org.solmass.scene;

import org.junit.jupiter.api.Test;
import org.solmass.surface.Patch;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@link HemisphereSampler#skyRays}, which traces only the rays that can reach the sky, against
 * {@link HemisphereSampler#classify}, which traces them all: the same directions and, ray by ray,
 * sky exactly where classify says {@link HemisphereSampler#SKY}. The scenes hold every way a ray
 * can end: blocks, the ground plane from above and (for a patch below it) from below, the far
 * horizon, and downward rays with no ground plane.
 */
class SkyRaysTest {
    private static final int RAYS = 1024;

    @Test
    void skyRaysAreExactlyTheRaysClassifySendsToTheSky() {
        double[] ridge = new double[36];
        for (int i = 0; i < 36; i++) ridge[i] = 3 + 20 * Math.max(0, Math.cos(Math.toRadians(i * 10 - 200)));
        MassingModel2 m = new MassingModel2();
        int sky = 0, upBlocked = 0, upGround = 0, down = 0, checked = 0;
        for (boolean plane : new boolean[] {true, false}) {
            for (HorizonProfile h : new HorizonProfile[] {null, new HorizonProfile(ridge)}) {
                Scene scene = Scene.build(m.model, plane, 0);
                if (h != null) scene = scene.withHorizon(h);
                HemisphereSampler a = new HemisphereSampler(scene, RAYS), b = new HemisphereSampler(scene, RAYS);
                int n = a.rayCount();
                for (Patch p : m.patches) {
                    for (long seed : new long[] {3, 0x5eedL}) {
                        double[] d1 = new double[3 * n], d2 = new double[3 * n];
                        int[] cls = new int[n];
                        boolean[] open = new boolean[n];
                        a.classify(p, seed, null, d1, cls);
                        b.skyRays(p, seed, d2, open);
                        assertArrayEquals(d1, d2, "directions of " + p.id());
                        for (int s = 0; s < n; s++) {
                            assertEquals(cls[s] == HemisphereSampler.SKY, open[s], p.id() + " ray " + s + " class " + cls[s]
                                    + (plane ? " with" : " without") + " the ground plane" + (h != null ? ", far horizon" : ""));
                            checked++;
                            if (open[s]) sky++;
                            else if (d1[3 * s + 2] < 0) down++;
                            else if (cls[s] == HemisphereSampler.BLOCK) upBlocked++;
                            else upGround++;
                        }
                    }
                }
            }
        }
        // every way a ray ends occurs, so the comparison is not empty for any of them
        assertTrue(sky > 1000 && upBlocked > 1000 && down > 1000, "sky " + sky + ", up and blocked " + upBlocked + ", down " + down);
        assertTrue(upGround > 100, "rays going up that meet the ground plane from below: " + upGround);
        assertTrue(checked == 4 * 6 * 2 * 1024, "rays compared: " + checked);
    }

    /** Two blocks across a street, facade, roof, tilted and sunken patches, and one facing down. */
    private static final class MassingModel2 {
        final org.solmass.model.MassingModel model = new SceneFixtures()
                .box(0, 0, 0, 30, 12, 18)
                .box(0, -30, 0, 30, -16, 27)
                .box(40, -10, -4, 44, 0, 2) // reaches below the ground plane: blocks rays from the sunken patch
                .model();
        final List<Patch> patches = new ArrayList<>();

        MassingModel2() {
            patches.add(SceneFixtures.patch("facade-south", 15, -0.01, 6, 0, -1, 0));
            patches.add(SceneFixtures.patch("facade-north", 15, -16 + 0.01, 3, 0, 1, 0));
            patches.add(SceneFixtures.patch("roof", 15, 6, 18.01, 0, 0, 1));
            double c = Math.cos(Math.toRadians(35)), s = Math.sin(Math.toRadians(35));
            patches.add(SceneFixtures.patch("tilted", 34, -6, 4, s, 0, c));
            patches.add(SceneFixtures.patch("sunken", 42, 3, -2, 0, 0, 1));
            patches.add(SceneFixtures.patch("underside", 10, 20, 5, 0, 0, -1));
        }
    }
}

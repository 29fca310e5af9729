package org.solmass.scene;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The kernel warm-up is only a speed measure: the rays of a scene get the same answers before and
 * after it (the kernels are the same code). Its speed is measured in docs/scene.md, not asserted here.
 */
class KernelWarmupTest {
    @Test
    void answersAreTheSameBeforeAndAfterTheWarmup() {
        Scene scene = Scene.build(new float[] {-5, -5, 3, 5, -5, 3, 0, 5, 3, -5, -5, 1, 5, -5, 1, 0, 5, 8}, true, 0.0);
        HemisphereSampler hs = new HemisphereSampler(scene, 1024);
        int n = hs.rayCount();
        double[] dir = new double[3 * n], dist = new double[n], dist2 = new double[n];
        int[] cls = new int[n], tri = new int[n], cls2 = new int[n], tri2 = new int[n];
        hs.sample(0.5, 0.2, 0.5, 0, 0, 1, 42L, null, dir, cls, tri, dist);
        assertTrue(KernelWarmup.run() >= 1);
        assertTrue(KernelWarmup.run() >= 1); // a second warm-up, on compiled kernels, ends too (its stall rule)
        hs.sample(0.5, 0.2, 0.5, 0, 0, 1, 42L, null, dir, cls2, tri2, dist2);
        for (int s = 0; s < n; s++) {
            assertEquals(cls[s], cls2[s]);
            assertEquals(tri[s], tri2[s]);
            assertEquals(Double.doubleToLongBits(dist[s]), Double.doubleToLongBits(dist2[s]));
        }
    }

    @Test
    void groundFlagsFlagSomethingOrAreDropped() {
        assertFalse(HemisphereSampler.anyFlagged(null));
        assertFalse(HemisphereSampler.anyFlagged(new boolean[7]));
        boolean[] one = new boolean[7];
        one[6] = true;
        assertTrue(HemisphereSampler.anyFlagged(one));
    }
}

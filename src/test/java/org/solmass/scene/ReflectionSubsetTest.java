package org.solmass.scene;

import org.junit.jupiter.api.Test;

import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The reflection subset of a patch's hemisphere rays ({@link HemisphereSampler#sampleForReflection}):
 * one ray per block of strata, the same classes as full sampling, the same first hits where traced,
 * and an unbiased estimate of a view factor known in closed form.
 */
class ReflectionSubsetTest {

    @Test
    void blockSideIsTheLargestDivisorKeepingTheRequestedRays() {
        assertEquals(2, HemisphereSampler.reflectionBlock(32, 256)); // 1024 rays -> 16 x 16 blocks of 2 x 2
        assertEquals(4, HemisphereSampler.reflectionBlock(64, 256)); // 4096 rays -> 16 x 16 blocks of 4 x 4
        assertEquals(1, HemisphereSampler.reflectionBlock(16, 256)); // 256 rays: every ray
        assertEquals(1, HemisphereSampler.reflectionBlock(30, 256)); // 900 rays: 30 / 2 = 15 < 16, every ray
        assertEquals(3, HemisphereSampler.reflectionBlock(48, 256)); // 2304 rays -> 16 x 16 blocks of 3 x 3
        assertEquals(256, HemisphereSampler.reflectionRayCount(1024, 256));
        assertEquals(900, HemisphereSampler.reflectionRayCount(900, 256));
    }

    @Test
    void subsetHoldsOneRayOfEveryBlockInAscendingOrder() {
        int side = 32, block = 2;
        boolean[] mark = new boolean[side * side];
        int[] subset = new int[side * side];
        for (long seed = 1; seed < 50; seed++) {
            int m = HemisphereSampler.chooseSubset(side, block, seed * 0x9e3779b97f4a7c15L, mark, subset);
            assertEquals(256, m);
            int[] perBlock = new int[256];
            for (int q = 0; q < m; q++) {
                if (q > 0) assertTrue(subset[q] > subset[q - 1]);
                int row = subset[q] / side, col = subset[q] % side;
                perBlock[(row / block) * (side / block) + col / block]++;
            }
            for (int c : perBlock) assertEquals(1, c);
        }
    }

    /**
     * The cell chosen in a block is uniform over the block's cells, which makes the chosen ray uniform
     * over the block: over 4000 seeds each of the 4 cells of a block is chosen a binomial(4000, 1/4)
     * number of times, mean 1000, standard deviation 27.4; allowed 5 standard deviations.
     */
    @Test
    void cellChosenInABlockIsUniform() {
        int side = 32, block = 2, seeds = 4000;
        boolean[] mark = new boolean[side * side];
        int[] subset = new int[side * side];
        int[][] counts = new int[3][4]; // three blocks: first, middle, last
        int[] blocks = {0, 7 * 16 + 9, 255};
        SplittableRandom rnd = new SplittableRandom(11);
        for (int i = 0; i < seeds; i++) {
            HemisphereSampler.chooseSubset(side, block, rnd.nextLong(), mark, subset);
            for (int b = 0; b < 3; b++) {
                int br = blocks[b] / 16, bc = blocks[b] % 16;
                for (int q = 0; q < 4; q++) if (mark[(br * 2 + q / 2) * side + bc * 2 + q % 2]) counts[b][q]++;
            }
        }
        double sd = Math.sqrt(seeds * 0.25 * 0.75);
        for (int[] c : counts) for (int q = 0; q < 4; q++) assertEquals(seeds / 4.0, c[q], 5 * sd, "cell " + q);
    }

    /** Against full sampling on random triangle soups (with and without a ground plane): same classes, same first hits on the subset. */
    @Test
    void classesAndSubsetHitsEqualFullSampling() {
        SplittableRandom rnd = new SplittableRandom(5);
        for (int sc = 0; sc < 6; sc++) {
            Scene scene = Scene.build(TracerTest.randomSoup(300 + sc, 200), sc % 2 == 0, 0.0);
            HemisphereSampler full = new HemisphereSampler(scene, 1024), part = new HemisphereSampler(scene, 1024);
            int n = full.rayCount();
            double[] dirA = new double[3 * n], dirB = new double[3 * n], distA = new double[n], distB = new double[n];
            int[] clsA = new int[n], clsB = new int[n], triA = new int[n], triB = new int[n], subset = new int[n];
            for (int p = 0; p < 40; p++) {
                double ox = rnd.nextDouble(-5, 5), oy = rnd.nextDouble(-5, 5), oz = rnd.nextDouble(0.1, 6);
                double nx = rnd.nextDouble(-1, 1), ny = rnd.nextDouble(-1, 1), nz = rnd.nextDouble(-1, 1);
                double l = Math.sqrt(nx * nx + ny * ny + nz * nz);
                long seed = rnd.nextLong();
                full.sample(ox, oy, oz, nx / l, ny / l, nz / l, seed, null, dirA, clsA, triA, distA);
                int m = part.sampleForReflection(ox, oy, oz, nx / l, ny / l, nz / l, seed, null, false, 2,
                        dirB, clsB, triB, distB, subset);
                assertEquals(256, m);
                assertArrayEquals(dirA, dirB);
                assertArrayEquals(clsA, clsB, "scene " + sc + " patch " + p);
                for (int q = 0; q < m; q++) {
                    int s = subset[q];
                    assertEquals(triA[s], triB[s]);
                    assertEquals(distA[s], distB[s]);
                }
            }
        }
    }

    /**
     * The share of the subset's rays that hit a parallel square above a horizontal patch estimates the
     * view factor from a differential element to a parallel rectangle centred above it: four times the
     * corner case {@code F = 1/(2 pi) [A/sqrt(1+A^2) atan(B/sqrt(1+A^2)) + B/sqrt(1+B^2) atan(A/sqrt(1+B^2))]},
     * A = a/c, B = b/c (Howell, Menguc and Siegel, Thermal Radiation Heat Transfer, view factor
     * catalogue, differential element to parallel rectangle; from memory). Over 200 patches of 256
     * rays the mean must match within 4 standard errors of the mean (the binomial bound, which
     * stratification only lowers).
     */
    @Test
    void subsetEstimatesTheViewFactorOfAParallelSquare() {
        double half = 3, c = 4; // a 6 m square 4 m above the patch
        float[] soup = {
                (float) -half, (float) -half, (float) c, (float) half, (float) -half, (float) c, (float) half, (float) half, (float) c,
                (float) -half, (float) -half, (float) c, (float) half, (float) half, (float) c, (float) -half, (float) half, (float) c};
        Scene scene = Scene.build(soup, false, 0.0);
        double a = half / c, corner = (a / Math.sqrt(1 + a * a) * Math.atan(a / Math.sqrt(1 + a * a))) * 2 / (2 * Math.PI);
        double exact = 4 * corner;
        HemisphereSampler hs = new HemisphereSampler(scene, 1024);
        int n = hs.rayCount(), patches = 200;
        double[] dir = new double[3 * n], dist = new double[n];
        int[] cls = new int[n], tri = new int[n], subset = new int[n];
        SplittableRandom rnd = new SplittableRandom(3);
        double sum = 0;
        for (int p = 0; p < patches; p++) {
            int m = hs.sampleForReflection(0, 0, 0, 0, 0, 1, rnd.nextLong(), null, false, 2, dir, cls, tri, dist, subset);
            int hits = 0;
            for (int q = 0; q < m; q++) if (tri[subset[q]] >= 0) hits++;
            sum += hits / (double) m;
        }
        double mean = sum / patches, se = Math.sqrt(exact * (1 - exact) / 256 / patches);
        assertEquals(exact, mean, 4 * se, "view factor " + exact);
    }
}

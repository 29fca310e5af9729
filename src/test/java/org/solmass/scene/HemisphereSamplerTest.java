package org.solmass.scene;

import org.junit.jupiter.api.Test;

import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.*;

class HemisphereSamplerTest {

    @Test
    void rayCountsRoundToASquareGrid() {
        assertEquals(1024, HemisphereSampler.roundedRayCount(1024));
        assertEquals(1024, HemisphereSampler.roundedRayCount(1000));
        assertEquals(49, HemisphereSampler.roundedRayCount(50));
        assertEquals(1, HemisphereSampler.roundedRayCount(1));
        assertThrows(IllegalArgumentException.class, () -> HemisphereSampler.roundedRayCount(0));
    }

    @Test
    void directionsAreCosineDistributedUnitVectorsAboutTheNormal() {
        // cosine-weighted density cos(theta)/pi: E[cos theta] = 2/3, E[cos^2 theta] = 1/2 (analytic;
        // common practice). Tolerance: 3 standard errors of simple random sampling (stratified
        // sampling can only be more precise): sd(cos) = sqrt(1/2 - 4/9) = 0.236, N = 1024.
        Scene s = Scene.build(new float[0], false, 0);
        HemisphereSampler h = new HemisphereSampler(s, 1024);
        double[] dir = new double[3 * 1024];
        SplittableRandom r = new SplittableRandom(3);
        for (int k = 0; k < 20; k++) {
            double nx = r.nextGaussian(), ny = r.nextGaussian(), nz = r.nextGaussian();
            double l = Math.sqrt(nx * nx + ny * ny + nz * nz);
            nx /= l; ny /= l; nz /= l;
            if (k == 0) { nx = 0; ny = 0; nz = -1; }
            if (k == 1) { nx = 0; ny = 0; nz = 1; }
            h.directions(nx, ny, nz, r.nextLong(), dir);
            double m1 = 0, m2 = 0, sx = 0, sy = 0, sz = 0;
            for (int i = 0; i < 1024; i++) {
                double dx = dir[3 * i], dy = dir[3 * i + 1], dz = dir[3 * i + 2];
                assertEquals(1.0, dx * dx + dy * dy + dz * dz, 1e-12);
                double c = dx * nx + dy * ny + dz * nz;
                assertTrue(c >= -1e-12, "direction below the patch plane");
                m1 += c; m2 += c * c;
                sx += dx; sy += dy; sz += dz;
            }
            double se = 3 * Math.sqrt(0.5 - 4.0 / 9) / Math.sqrt(1024);
            assertEquals(2.0 / 3, m1 / 1024, se);
            assertEquals(0.5, m2 / 1024, 3 * Math.sqrt(1.0 / 3 - 0.25) / Math.sqrt(1024));
            // mean direction = (2/3) n by symmetry
            assertEquals(2.0 / 3 * nx, sx / 1024, se);
            assertEquals(2.0 / 3 * ny, sy / 1024, se);
            assertEquals(2.0 / 3 * nz, sz / 1024, se);
        }
    }

    @Test
    void raysDependOnlyOnPatchIdAndRunSeed() {
        assertEquals(HemisphereSampler.patchSeed("B1-S2-P0003", 7), HemisphereSampler.patchSeed("B1-S2-P0003", 7));
        assertNotEquals(HemisphereSampler.patchSeed("B1-S2-P0003", 7), HemisphereSampler.patchSeed("B1-S2-P0004", 7));
        assertNotEquals(HemisphereSampler.patchSeed("B1-S2-P0003", 7), HemisphereSampler.patchSeed("B1-S2-P0003", 8));
        Scene s = Scene.build(new float[0], true, 0);
        double[] a = new double[300], b = new double[300];
        new HemisphereSampler(s, 100).directions(0, 0, 1, 42, a);
        new HemisphereSampler(s, 100).directions(0, 0, 1, 42, b);
        assertArrayEquals(a, b);
    }

    @Test
    void sineAndCosineKernelsEqualStrictMathOnTheConcentricMapsRange() {
        // java.lang.StrictMath is fdlibm 5.3, whose sin and cos are exactly __kernel_sin/__kernel_cos
        // for |x| <= pi/4 (fdlibm s_sin.c, s_cos.c); the kernels must give its values bit for bit.
        SplittableRandom r = new SplittableRandom(11);
        double[] edges = {0.0, -0.0, Math.PI / 4, -Math.PI / 4, 0x1.0p-27, Math.nextDown(0x1.0p-27), 1e-300,
                HemisphereSampler.COS_SPLIT, Math.nextDown(HemisphereSampler.COS_SPLIT),
                HemisphereSampler.COS_QX_FIXED, Math.nextDown(HemisphereSampler.COS_QX_FIXED), 0.78125, 0.3};
        for (double x : edges) {
            for (double v : new double[] {x, -x}) {
                assertEquals(Double.doubleToRawLongBits(StrictMath.sin(v)), Double.doubleToRawLongBits(HemisphereSampler.sinKernel(v)), "sin " + v);
                assertEquals(Double.doubleToRawLongBits(StrictMath.cos(v)), Double.doubleToRawLongBits(HemisphereSampler.cosKernel(v)), "cos " + v);
            }
        }
        for (int i = 0; i < 2_000_000; i++) {
            double v = r.nextDouble(-Math.PI / 4, Math.PI / 4);
            if (i % 4 == 0) v = Math.scalb(v, -r.nextInt(40)); // small angles too
            assertEquals(Double.doubleToRawLongBits(StrictMath.sin(v)), Double.doubleToRawLongBits(HemisphereSampler.sinKernel(v)), "sin " + v);
            assertEquals(Double.doubleToRawLongBits(StrictMath.cos(v)), Double.doubleToRawLongBits(HemisphereSampler.cosKernel(v)), "cos " + v);
        }
    }

    @Test
    void vectorDirectionsEqualScalarDirectionsBitForBit() {
        org.junit.jupiter.api.Assumptions.assumeTrue(BundleTracer.SIMD_AVAILABLE, "vector module not loaded");
        SplittableRandom r = new SplittableRandom(5);
        for (int side : new int[] {1, 2, 3, 7, 10, 32, 45}) {
            VectorDirections v = new VectorDirections(side);
            double[] a = new double[3 * side * side], b = new double[3 * side * side];
            for (int k = 0; k < 60; k++) {
                double nx = r.nextGaussian(), ny = r.nextGaussian(), nz = r.nextGaussian();
                double l = Math.sqrt(nx * nx + ny * ny + nz * nz);
                nx /= l; ny /= l; nz /= l;
                if (k == 0) { nx = 0; ny = 0; nz = -1; }
                if (k == 1) { nx = 0; ny = 0; nz = 1; }
                if (k == 2) { nx = 1; ny = 0; nz = 0; }
                if (k == 3) { nx = 0; ny = -1; nz = 0; }
                long seed = r.nextLong();
                HemisphereSampler.scalarDirections(side, nx, ny, nz, seed, a);
                v.directions(nx, ny, nz, seed, b);
                for (int i = 0; i < a.length; i++) {
                    assertEquals(Double.doubleToRawLongBits(a[i]), Double.doubleToRawLongBits(b[i]), "side " + side + " component " + i);
                }
            }
        }
    }
}

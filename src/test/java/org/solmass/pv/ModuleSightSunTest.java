package org.solmass.pv;

import org.junit.jupiter.api.Test;
import org.solmass.model.Vec3;
import org.solmass.scene.Scene;
import org.solmass.scene.Tracer;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Property (common practice for a packet tracer: a ray's answer does not depend on the rays traced
 * with it): the modules' sun visibility of {@link ModuleSight} (the sun directions in front of a module
 * plane packed once per plane and traced from every sample point of its modules) equals, for every
 * module, substring and sun direction, the share of its sample points from which the single-ray
 * {@link Tracer#occluded} finds the direction free, and 0 for a direction behind the module. The
 * modules' planes alternate (flat, tilted south, facing east, flat again ...), so a worker's shared
 * set must follow every change of plane; blocks of an invented scene and the ground plane shade some
 * of the points.
 */
class ModuleSightSunTest {
    @Test
    void sunVisibilityEqualsSingleRayAnswersAsThePlanesAlternate() {
        float[] a = ParapetShadingTest.box(5, 5, 0, 12, 9, 14), b = ParapetShadingTest.box(-14, -3, 0, -8, 6, 9),
                c = ParapetShadingTest.box(-2, 12, 0, 6, 16, 20);
        float[] soup = new float[a.length + b.length + c.length];
        System.arraycopy(a, 0, soup, 0, a.length);
        System.arraycopy(b, 0, soup, a.length, b.length);
        System.arraycopy(c, 0, soup, a.length + b.length, c.length);
        Scene scene = Scene.build(soup, true, 0);
        double t = Math.toRadians(30);
        Vec3[][] planes = { // normal, length axis, width axis
                {new Vec3(0, 0, 1), new Vec3(1.7, 0, 0), new Vec3(0, 1.0, 0)},
                {new Vec3(0, -Math.sin(t), Math.cos(t)), new Vec3(1.7, 0, 0), new Vec3(0, Math.cos(t), Math.sin(t))},
                {new Vec3(1, 0, 0), new Vec3(0, 1.7, 0), new Vec3(0, 0, 1.0)}};
        SplittableRandom r = new SplittableRandom(8);
        List<PvModule> mods = new ArrayList<>();
        for (int i = 0; i < 60; i++) {
            int p = i % 4 == 3 ? 0 : i % 4; // flat, tilted, east, flat, ...
            Vec3 corner = new Vec3(r.nextDouble(-20, 20), r.nextDouble(-10, 20), p == 2 ? r.nextDouble(0.5, 6) : r.nextDouble(0.2, 4));
            mods.add(new PvModule(1 + p, corner, planes[p][1], planes[p][2], planes[p][0], false));
        }
        Vec3[] sun = new Vec3[40];
        for (int d = 0; d < sun.length; d++) {
            double az = r.nextDouble(0, 2 * Math.PI), el = Math.toRadians(r.nextDouble(2, 80));
            sun[d] = new Vec3(Math.sin(az) * Math.cos(el), Math.cos(az) * Math.cos(el), Math.sin(el));
        }
        int substrings = 2, along = 3, across = 2, points = along * across;
        ModuleSight sight = ModuleSight.compute(scene, new boolean[scene.triangleCount()], mods, substrings, sun, 16, 1L, along, across);
        Tracer single = scene.tracer();
        double eps = scene.epsilon();
        int partly = 0, behind = 0;
        for (int m = 0; m < mods.size(); m++) {
            PvModule mod = mods.get(m);
            Vec3 n = mod.normal();
            for (int k = 0; k < substrings; k++) {
                for (int d = 0; d < sun.length; d++) {
                    Vec3 v = sun[d];
                    float want = 0;
                    if (n.x() * v.x() + n.y() * v.y() + n.z() * v.z() > 0) {
                        int free = 0;
                        for (int i = 0; i < along; i++) {
                            for (int j = 0; j < across; j++) {
                                Vec3 p = mod.at((i + 0.5) / along, (k + (j + 0.5) / across) / substrings);
                                if (!single.occluded(p.x() + eps * n.x(), p.y() + eps * n.y(), p.z() + eps * n.z(),
                                        v.x(), v.y(), v.z(), Double.POSITIVE_INFINITY)) free++;
                            }
                        }
                        want = (float) free / points;
                        if (free > 0 && free < points) partly++;
                    } else {
                        behind++;
                    }
                    assertEquals(want, sight.sunVisible(m, k, d), 0.0, "module " + m + " substring " + k + " direction " + d);
                }
            }
        }
        // preconditions of the check, not results: partly shaded substrings, directions behind modules
        assertTrue(partly > 20, "partly shaded substring-directions: " + partly);
        assertTrue(behind > 100, "directions behind a module: " + behind);
    }
}

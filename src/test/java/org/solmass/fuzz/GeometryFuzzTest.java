package org.solmass.fuzz;

import com.code_intelligence.jazzer.junit.FuzzTest;
import org.solmass.check.Plausibility;
import org.solmass.model.MassingModel;
import org.solmass.model.ModelOptions;
import org.solmass.model.ObjReader;
import org.solmass.surface.Patch;
import org.solmass.surface.PatchOptions;
import org.solmass.surface.PatchSet;
import org.solmass.surface.Patcher;

import java.nio.charset.StandardCharsets;
import java.util.Set;

/**
 * Fuzz target: OBJ text through the geometry stages, model -> surfaces -> patches (seeds in
 * GeometryFuzzTestInputs/), where winding, stray vertices and odd faces used to give silent garbage.
 * The patch size is an eighth of the model's largest extent, so a surface has at most about 8 x 8
 * cells and one input stays small whatever its scale. Beyond FuzzCheck's criteria, every patch must
 * have a finite positive area and a finite unit normal.
 */
class GeometryFuzzTest {
    static {
        // Load and instrument the geometry classes (JTS, the patcher's streams) once before the first
        // input: FuzzCheck counts the allocation of the thread, and class loading is not the input's.
        try {
            MassingModel m = ObjReader.parse("v 0 0 0\nv 1 0 0\nv 1 1 0\nv 0 1 0\nv 0 0 1\nf 1 2 3 4\nf 1 2 5\n",
                    "warm-up.obj", ModelOptions.defaults()).model();
            Plausibility.surfaces(m, Patcher.build(m, new PatchOptions(0.5, Set.of(), true)).surfaces());
        } catch (RuntimeException e) {
            throw new ExceptionInInitializerError(e);
        }
    }

    @FuzzTest(maxDuration = "10s")
    void modelSurfacesAndPatchesOrAnInputError(byte[] data) {
        String text = new String(data, StandardCharsets.UTF_8);
        FuzzCheck.check("ObjReader.parse + Patcher.build", data.length, () -> {
            MassingModel m = ObjReader.parse(text, "fuzz.obj", ModelOptions.defaults()).model();
            double[] b = m.bounds();
            double extent = Math.max(b[3] - b[0], Math.max(b[4] - b[1], b[5] - b[2]));
            PatchSet ps = Patcher.build(m, new PatchOptions(Math.max(extent / 8, 1e-6), Set.of(), true));
            for (Patch p : ps.patches()) {
                double n = p.normal().length();
                if (!(p.areaM2() > 0) || !Double.isFinite(p.areaM2()) || !(Math.abs(n - 1) < 1e-9)) {
                    throw new AssertionError("patch " + p.id() + ": area " + p.areaM2() + ", normal length " + n);
                }
            }
            Plausibility.model(m);
            Plausibility.surfaces(m, ps.surfaces());
        });
    }
}

package org.solmass.model;

import org.junit.jupiter.api.Test;
import org.solmass.InputException;

import static org.junit.jupiter.api.Assertions.*;

class ModelOptionsTest {
    private static final String ONE_POINT = "v 1 2 3\nv 0 0 0\nv 1 0 0\nf 1 2 3\n";

    private static double[] firstVertex(ModelOptions o) {
        double[] v = ObjReader.parse(ONE_POINT, "p.obj", o).model().vertices();
        return new double[]{v[0], v[1], v[2]};
    }

    @Test
    void defaultsAreZUpMetresNorthAlongY() {
        ModelOptions d = ModelOptions.defaults();
        assertEquals(UpAxis.Z, d.up());
        assertEquals(LengthUnit.M, d.unit());
        assertEquals(0.0, d.northDeg());
        assertArrayEquals(new double[]{1, 2, 3}, firstVertex(d), 0);
    }

    @Test
    void unitFactorsToMetres() {
        // SI prefixes; international foot = 0.3048 m exactly (1959 agreement)
        assertArrayEquals(new double[]{0.01, 0.02, 0.03}, firstVertex(new ModelOptions(UpAxis.Z, LengthUnit.CM, 0)), 1e-15);
        assertArrayEquals(new double[]{0.001, 0.002, 0.003}, firstVertex(new ModelOptions(UpAxis.Z, LengthUnit.MM, 0)), 1e-15);
        assertArrayEquals(new double[]{0.3048, 0.6096, 0.9144}, firstVertex(new ModelOptions(UpAxis.Z, LengthUnit.FT, 0)), 1e-15);
    }

    @Test
    void yUpMapsXYZToXMinusZYKeepingHandedness() {
        assertArrayEquals(new double[]{1, -3, 2}, firstVertex(new ModelOptions(UpAxis.Y, LengthUnit.M, 0)), 0);
        // A triangle facing OBJ +y (up in a Y-up tool) must face +z after import, and one facing
        // OBJ +z (towards the viewer, i.e. south in a Y-up tool) must face -y.
        MassingModel m = ObjReader.parse("v 0 0 0\nv 0 0 1\nv 1 0 0\nf 1 2 3\nv 0 0 0\nv 1 0 0\nv 0 1 0\nf 4 5 6\n",
                "y.obj", new ModelOptions(UpAxis.Y, LengthUnit.M, 0)).model();
        assertEquals(1.0, ObjReaderTest.normalOf(m, 0).z(), 1e-12);
        assertEquals(-1.0, ObjReaderTest.normalOf(m, 1).y(), 1e-12);
    }

    @Test
    void modelWhoseYPointsEastNeedsNorthMinus90() {
        // Definition: northDeg = clockwise angle from model +y to true north. If +y points true east,
        // true north is 90 degrees anticlockwise of +y, so northDeg = -90 (same as 270).
        // After import the model's +y axis (point 0,1,0) must point true east (+x), and model -x
        // (which is true north for such a right-handed model) must point +y.
        String obj = "v 0 1 0\nv -1 0 0\nv 0 0 0\nf 1 2 3\n";
        for (double north : new double[]{-90, 270}) {
            double[] v = ObjReader.parse(obj, "e.obj", new ModelOptions(UpAxis.Z, LengthUnit.M, north)).model().vertices();
            assertArrayEquals(new double[]{1, 0, 0}, new double[]{v[0], v[1], v[2]}, 1e-12);
            assertArrayEquals(new double[]{0, 1, 0}, new double[]{v[3], v[4], v[5]}, 1e-12);
        }
    }

    @Test
    void northRotationIsAppliedAfterUnitsAndUpAxis() {
        // OBJ (1,2,3) in cm, Y-up -> (0.01, -0.03, 0.02); north 90 rotates +y to -x: (x,y) -> (-y, x)
        assertArrayEquals(new double[]{0.03, 0.01, 0.02},
                firstVertex(new ModelOptions(UpAxis.Y, LengthUnit.CM, 90)), 1e-15);
    }

    @Test
    void parseAcceptsLowerCaseAndRejectsOthersNamingTheFlag() {
        assertEquals(UpAxis.Y, UpAxis.parse("y", "--up"));
        assertEquals(LengthUnit.MM, LengthUnit.parse("mm", "--unit"));
        assertEquals(LengthUnit.FT, LengthUnit.parse("FT", "--unit"));
        InputException e = assertThrows(InputException.class, () -> LengthUnit.parse("inch", "--unit"));
        assertTrue(e.getMessage().startsWith("--unit: "), e.getMessage());
        assertTrue(e.getMessage().contains("m, cm, mm or ft"));
        InputException e2 = assertThrows(InputException.class, () -> UpAxis.parse("x", "--up"));
        assertTrue(e2.getMessage().contains("y or z"));
        assertThrows(InputException.class, () -> new ModelOptions(UpAxis.Z, LengthUnit.M, Double.NaN));
    }
}

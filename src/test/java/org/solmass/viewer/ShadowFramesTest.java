package org.solmass.viewer;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The viewer reads a shadow study table in the layout of docs/metrics.md "Shadow studies" (header
 * first; one row per date, time and block) back into frames: per date and time the sun position
 * and each block's sunlit share, exactly as written (values below invented).
 */
class ShadowFramesTest {
    static final String CSV = String.join("\n",
            "date,time,sun_azimuth_deg,sun_elevation_deg,name,role,area_m2,sunlit_area_m2,sunlit_pct",
            "03-21,09:00,120.50,25.10,A,analysed,100.00,40.00,40.0",
            "03-21,09:00,120.50,25.10,B,context,50.00,50.00,100.0",
            "03-21,09:00,120.50,25.10,ground,ground,900.00,600.00,66.7",
            "03-21,12:00,180.20,38.70,A,analysed,100.00,100.00,100.0",
            "03-21,12:00,180.20,38.70,B,context,50.00,0.00,0.0",
            "06-21,09:00,100.00,45.00,A,analysed,100.00,55.00,55.0",
            "06-21,12:00,181.00,62.00,A,analysed,100.00,90.00,90.0", "");

    @TempDir Path dir;

    @Test
    void readingTheTableGivesEachDateAndTimeWithItsSunAndEachBlocksSunlitShare() throws Exception {
        Files.createDirectories(dir.resolve("shadows"));
        Files.writeString(dir.resolve(ShadowFrames.FILE), CSV);
        ShadowFrames s = ShadowFrames.ofFolder(dir);
        assertEquals(4, s.frames().size());
        assertEquals(List.of("03-21", "06-21"), s.dates());
        assertEquals(List.of("09:00", "12:00"), s.times());
        ShadowFrames.Frame f = s.frame("03-21", "09:00");
        assertEquals(120.5, f.sunAzimuthDeg(), 0);
        assertEquals(25.1, f.sunElevationDeg(), 0);
        assertEquals(40.0, f.sunlitPct("A"), 0);
        assertEquals(100.0, f.sunlitPct("B"), 0);
        assertEquals(66.7, f.sunlitPct("ground"), 0);
        assertEquals(0.0, s.frame("03-21", "12:00").sunlitPct("B"), 0);
        assertTrue(Double.isNaN(s.frame("06-21", "12:00").sunlitPct("B")), "a block without a row has no share");
    }

    @Test
    void aFolderWithoutTheTableHasNoShadowStudy() {
        assertSame(ShadowFrames.NONE, ShadowFrames.ofFolder(dir));
        assertTrue(SyntheticViewerData.courtyard().shadows().isEmpty());
    }

    @Test
    void viewerDataCarriesTheShadowStudyItIsGiven() throws Exception {
        Path f = dir.resolve("s.csv");
        Files.writeString(f, CSV);
        ShadowFrames s = ShadowFrames.read(f);
        ViewerData d = SyntheticViewerData.courtyard().withShadows(s);
        assertSame(s, d.shadows());
        assertSame(s, d.withModuleRings(List.of()).shadows(), "adding module outlines keeps the shadow study");
    }

    /** A per-patch table in the layout of docs/outputs.md (values invented): a roof patch, a wall patch, a ground cell. */
    static final String PATCHES = String.join("\n",
            "patch_id,role,block,kind,area_m2,normal_x,normal_y,normal_z,outline_m,sunlit_03-21_09:00,sunlit_03-21_12:00",
            "B0-S0-P0000,analysed,A,roof,1.0000,0.000000,0.000000,1.000000,0 0 10 1 0 10 1 1 10 0 1 10,1,1",
            "B1-S2-P0003,context,B,facade,1.0000,0.000000,-1.000000,0.000000,5 0 0 6 0 0 6 0 1 5 0 1,0,1",
            "G-P0000-0001,ground,ground,ground,4.0000,0.000000,0.000000,1.000000,2 -4 0 4 -4 0 4 -2 0 2 -2 0,0,0", "");

    @Test
    void thePerPatchTableGivesEachPatchItsSunOrShadeAtEachDateAndTimeWithItsOutline() throws Exception {
        Files.createDirectories(dir.resolve("shadows"));
        Files.writeString(dir.resolve(ShadowFrames.FILE), CSV);
        Files.writeString(dir.resolve(ShadowFrames.PATCH_FILE), PATCHES);
        ShadowFrames s = ShadowFrames.ofFolder(dir);
        assertTrue(s.hasPatches());
        assertEquals(List.of("analysed", "context", "ground"), s.perPatch().roles());
        org.junit.jupiter.api.Assertions.assertArrayEquals(new boolean[] {true, false, false}, s.sunlit(s.frame("03-21", "09:00")));
        org.junit.jupiter.api.Assertions.assertArrayEquals(new boolean[] {true, true, false}, s.sunlit(s.frame("03-21", "12:00")));
        assertEquals(null, s.sunlit(s.frame("06-21", "09:00")), "a moment without a column has no per-patch answer");
        org.solmass.surface.Patch ground = s.perPatch().patches().get(2);
        assertEquals(-1, ground.block(), "the ground grid belongs to no block");
        assertEquals(3, ground.centroid().x(), 1e-12, "centre of the 2 m cell");
        assertEquals(-3, ground.centroid().y(), 1e-12);
        assertEquals(180, s.perPatch().patches().get(1).azimuthDeg(), 1e-9, "a wall facing south");
        assertEquals(2, ground.triangles().length / 3, "a square cell is drawn as two triangles");
    }

    @Test
    void withoutThePerPatchTableTheStudyIsPerBlock() throws Exception {
        Files.createDirectories(dir.resolve("shadows"));
        Files.writeString(dir.resolve(ShadowFrames.FILE), CSV);
        ShadowFrames s = ShadowFrames.ofFolder(dir);
        assertTrue(!s.hasPatches());
        assertEquals(null, s.sunlit(s.frame("03-21", "09:00")));
    }

    @Test
    void allInShadeAndAllInSunGetTheTwoLegendColoursAndAMissingBlockIsGrey() {
        assertEquals(ShadowControl.SHADE_RGB, ShadowControl.rgb(0));
        assertEquals(ShadowControl.SUN_RGB, ShadowControl.rgb(100));
        assertEquals(ColourScale.NAN_RGB, ShadowControl.rgb(Double.NaN));
    }
}

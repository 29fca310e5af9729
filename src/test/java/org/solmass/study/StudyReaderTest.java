package org.solmass.study;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.InputException;
import org.solmass.climate.ClimateSpec;
import org.solmass.climate.TimeBaseChoice;
import org.solmass.model.LengthUnit;
import org.solmass.model.UpAxis;
import org.solmass.sky.Isotropic;
import org.solmass.sky.Perez;
import org.solmass.study.Study.*;
import org.solmass.sun.Site;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.ZoneId;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

class StudyReaderTest {
    @TempDir Path dir;

    static final String FULL = """
            {
              "name": "Invented courtyard",
              "description": "invented scenario",
              "model": { "file": "massing/block.obj", "up": "y", "unit": "cm", "north_deg": 12.5,
                         "analyse": ["A", "B"], "context": ["C"] },
              "site": { "latitude": 48.2, "longitude": 16.37, "elevation_m": 180, "zone": "Europe/Vienna" },
              "climate": { "source": "weather/year.csv", "format": "hourly", "interval_label": "start",
                           "fill_gaps": true, "year": 2019 },
              "albedo": { "ground": 0.15, "blocks_default": 0.35, "blocks": { "A": 0.5 }, "materials": { "glass": 0.08 } },
              "ground_irradiance": "shaded",
              "patch_m": 0.5,
              "rays": 256,
              "sky": "isotropic",
              "time_base": "hourly-year",
              "sun_bins": 2048,
              "step_minutes": 15,
              "outputs": { "folder": "out", "month_hour_csv": true, "map": false,
                           "map_width_px": 1200, "map_height_px": 700, "thresholds_kwh_m2": [400, 800] },
              "threads": 2
            }
            """;

    private Path write(String name, String json) throws Exception {
        Path p = dir.resolve(name);
        Files.createDirectories(p.getParent());
        Files.writeString(p, json);
        return p;
    }

    private InputException fails(String json) throws Exception {
        Path p = write("study.json", json);
        return assertThrows(InputException.class, () -> StudyReader.read(p));
    }

    private static final String MIN_SITE = "\"site\": {\"latitude\": 52, \"longitude\": 13, \"zone\": \"+01:00\"}";

    @Test
    void everyKeyIsParsedAndRelativePathsResolveAgainstTheStudyFolder() throws Exception {
        Path p = write("studies/full.json", FULL);
        Study s = StudyReader.read(p);
        Path base = p.toAbsolutePath().getParent();
        assertEquals("Invented courtyard", s.name());
        assertEquals("invented scenario", s.description());
        assertEquals(p.toAbsolutePath().normalize(), s.source());
        assertEquals(base.resolve("massing/block.obj"), s.model().file());
        assertEquals(UpAxis.Y, s.model().up());
        assertEquals(LengthUnit.CM, s.model().unit());
        assertEquals(12.5, s.model().northDeg());
        assertEquals(List.of("A", "B"), s.model().analyse());
        assertEquals(List.of("C"), s.model().context());
        assertEquals(new Site(48.2, 16.37, 180, ZoneId.of("Europe/Vienna")), s.site());
        assertEquals(base.resolve("weather/year.csv"), s.climate().file());
        assertEquals(ClimateSpec.Format.HOURLY, s.climate().format());
        assertEquals(ClimateSpec.IntervalLabel.START, s.climate().intervalLabel());
        assertTrue(s.climate().fillGaps());
        assertEquals(2019, s.climate().year());
        assertEquals(0.15, s.albedo().ground());
        assertEquals(0.35, s.albedo().blocksDefault());
        assertEquals(Map.of("A", 0.5), s.albedo().blocks());
        assertEquals(Map.of("glass", 0.08), s.albedo().materials());
        assertEquals(GroundIrradiance.SHADED, s.groundIrradiance());
        assertEquals(0.5, s.patchM());
        assertEquals(256, s.rays());
        assertEquals(Isotropic.INSTANCE, s.sky());
        assertEquals(TimeBaseChoice.HOURLY_YEAR, s.timeBase());
        assertEquals(2048, s.sunBins());
        assertEquals(15, s.stepMinutes());
        assertEquals(base.resolve("out"), s.outputs().folder());
        assertTrue(s.outputs().monthHourCsv());
        assertFalse(s.outputs().map());
        assertEquals(1200, s.outputs().mapWidthPx());
        assertEquals(700, s.outputs().mapHeightPx());
        assertEquals(List.of(400.0, 800.0), s.outputs().thresholdsKwhM2());
        assertEquals(2, s.threads());
    }

    @Test
    void defaultsApplyWhereKeysAreLeftOut() throws Exception {
        Path p = write("minimal.json", "{\"model\": {\"file\": \"m.obj\"}, " + MIN_SITE + "}");
        Study s = StudyReader.read(p);
        assertEquals("minimal", s.name());
        assertEquals("", s.description());
        assertEquals(UpAxis.Z, s.model().up());
        assertEquals(LengthUnit.M, s.model().unit());
        assertEquals(0, s.model().northDeg());
        assertTrue(s.model().analyse().isEmpty());
        assertTrue(s.model().isAnalysed("anything"));
        assertEquals(0, s.site().elevationM());
        assertTrue(s.climate().isClearSky());
        assertEquals(ClimateSpec.Format.AUTO, s.climate().format());
        assertEquals(ClimateSpec.IntervalLabel.START, s.climate().intervalLabel());
        assertFalse(s.climate().fillGaps());
        assertEquals(Climate.DEFAULT_YEAR, s.climate().year());
        assertEquals(0.2, s.albedo().ground());
        assertEquals(0.3, s.albedo().blocksDefault());
        assertEquals(GroundIrradiance.SHADED, s.groundIrradiance(), "docs/study-file.md: shaded ground by default");
        assertEquals(1.0, s.patchM());
        assertEquals(1024, s.rays());
        assertEquals(Perez.INSTANCE, s.sky());
        assertEquals(TimeBaseChoice.AUTO, s.timeBase());
        assertEquals(4096, s.sunBins());
        assertEquals(60, s.stepMinutes());
        assertEquals(dir.toAbsolutePath().resolve("results"), s.outputs().folder());
        assertFalse(s.outputs().monthHourCsv());
        assertTrue(s.outputs().map());
        assertEquals(List.of(300.0, 600.0, 900.0, 1200.0), s.outputs().thresholdsKwhM2());
        assertEquals(0, s.threads());
    }

    @Test
    void albedoOfAFacePrefersMaterialThenBlockThenDefault() throws Exception {
        Study s = StudyReader.read(write("s.json", FULL));
        assertEquals(0.08, s.albedo().of("A", "glass"));
        assertEquals(0.5, s.albedo().of("A", "brick"));
        assertEquals(0.35, s.albedo().of("B", null));
    }

    @Test
    void contextBlocksAreNotAnalysed() throws Exception {
        Study s = StudyReader.read(write("s.json", FULL));
        assertTrue(s.model().isAnalysed("A"));
        assertFalse(s.model().isAnalysed("C"));
        assertFalse(s.model().isAnalysed("D"));   // analyse lists A and B only
    }

    @Test
    void unknownKeyIsNamedWithItsFullPath() throws Exception {
        InputException e = fails("{\"model\": {\"file\": \"m.obj\"}, \"site\": {\"latitude\": 52, \"longitude\": 13, \"zone\": \"UTC\", \"lattitude\": 1}}");
        assertTrue(e.getMessage().contains("study.json: site.lattitude: unknown key"), e.getMessage());
    }

    @Test
    void unknownTopLevelKeyIsAnError() throws Exception {
        InputException e = fails("{\"model\": {\"file\": \"m.obj\"}, " + MIN_SITE + ", \"patch_size\": 2}");
        assertTrue(e.getMessage().contains("patch_size: unknown key"), e.getMessage());
    }

    @Test
    void wrongTypeNamesTheKeyAndWhatWasExpected() throws Exception {
        InputException e = fails("{\"model\": {\"file\": \"m.obj\"}, \"site\": {\"latitude\": \"north\", \"longitude\": 13, \"zone\": \"UTC\"}}");
        assertTrue(e.getMessage().endsWith("study.json: site.latitude: expected a number from -90 to 90, got \"north\""), e.getMessage());
    }

    @Test
    void latitudeOutOfRangeIsAnError() throws Exception {
        InputException e = fails("{\"model\": {\"file\": \"m.obj\"}, \"site\": {\"latitude\": 95, \"longitude\": 13, \"zone\": \"UTC\"}}");
        assertTrue(e.getMessage().contains("site.latitude: expected a number from -90 to 90, got 95"), e.getMessage());
    }

    @Test
    void longitudeOutOfRangeIsAnError() throws Exception {
        InputException e = fails("{\"model\": {\"file\": \"m.obj\"}, \"site\": {\"latitude\": 5, \"longitude\": 181, \"zone\": \"UTC\"}}");
        assertTrue(e.getMessage().contains("site.longitude"), e.getMessage());
    }

    @Test
    void patchSizeMustBePositive() throws Exception {
        InputException e = fails("{\"model\": {\"file\": \"m.obj\"}, " + MIN_SITE + ", \"patch_m\": 0}");
        assertTrue(e.getMessage().contains("patch_m: expected a number greater than 0"), e.getMessage());
    }

    @Test
    void raysMustBeAPositiveWholeNumber() throws Exception {
        assertTrue(fails("{\"model\": {\"file\": \"m.obj\"}, " + MIN_SITE + ", \"rays\": 0}").getMessage().contains("rays: expected a whole number"));
        assertTrue(fails("{\"model\": {\"file\": \"m.obj\"}, " + MIN_SITE + ", \"rays\": 10.5}").getMessage().contains("rays: expected a whole number"));
    }

    @Test
    void albedoOutsideZeroToOneIsAnError() throws Exception {
        InputException e = fails("{\"model\": {\"file\": \"m.obj\"}, " + MIN_SITE + ", \"albedo\": {\"blocks\": {\"Tower\": 1.2}}}");
        assertTrue(e.getMessage().contains("albedo.blocks.Tower: expected a number from 0 to 1, got 1.2"), e.getMessage());
    }

    @Test
    void unknownChoiceListsTheAllowedValues() throws Exception {
        InputException e = fails("{\"model\": {\"file\": \"m.obj\"}, " + MIN_SITE + ", \"sky\": \"cloudy\"}");
        assertTrue(e.getMessage().contains("sky: expected one of perez, isotropic, perez-1993, cie-overcast, cie-1, cie-2, cie-3, cie-4, cie-5, cie-6, cie-7, cie-8, cie-9, cie-10, cie-11, cie-12, cie-13, cie-14, cie-15, got \"cloudy\""), e.getMessage());
    }

    @Test
    void badTimeZoneIsAnError() throws Exception {
        InputException e = fails("{\"model\": {\"file\": \"m.obj\"}, \"site\": {\"latitude\": 5, \"longitude\": 1, \"zone\": \"Mars/Olympus\"}}");
        assertTrue(e.getMessage().contains("site.zone: expected an IANA time zone"), e.getMessage());
    }

    @Test
    void missingRequiredKeyIsNamed() throws Exception {
        InputException e = fails("{" + MIN_SITE + "}");
        assertTrue(e.getMessage().contains("model.file: missing"), e.getMessage());
    }

    @Test
    void wrongTypeInsideAnArrayNamesTheIndex() throws Exception {
        InputException e = fails("{\"model\": {\"file\": \"m.obj\", \"analyse\": [\"A\", 3]}, " + MIN_SITE + "}");
        assertTrue(e.getMessage().contains("model.analyse[1]: expected a name"), e.getMessage());
    }

    @Test
    void stepMinutesMustDivideAnHour() throws Exception {
        InputException e = fails("{\"model\": {\"file\": \"m.obj\"}, " + MIN_SITE + ", \"step_minutes\": 7}");
        assertTrue(e.getMessage().contains("step_minutes: expected a whole number of minutes that divides 60"), e.getMessage());
    }

    @Test
    void thresholdsMustAscend() throws Exception {
        InputException e = fails("{\"model\": {\"file\": \"m.obj\"}, " + MIN_SITE + ", \"outputs\": {\"thresholds_kwh_m2\": [600, 300]}}");
        assertTrue(e.getMessage().contains("outputs.thresholds_kwh_m2[1]: expected numbers in ascending order"), e.getMessage());
    }

    @Test
    void blockBothAnalysedAndContextIsAnError() throws Exception {
        InputException e = fails("{\"model\": {\"file\": \"m.obj\", \"analyse\": [\"A\"], \"context\": [\"A\"]}, " + MIN_SITE + "}");
        assertTrue(e.getMessage().contains("model.context[0]"), e.getMessage());
    }

    @Test
    void invalidJsonNamesTheLine() throws Exception {
        InputException e = fails("{\n  \"model\": {\"file\": \"m.obj\"},\n  \"rays\": 12,,\n}");
        assertTrue(e.getMessage().contains("study.json:3: not valid JSON"), e.getMessage());
    }

    @Test
    void duplicateKeyIsAnError() throws Exception {
        InputException e = fails("{\"rays\": 1, \"rays\": 2}");
        assertTrue(e.getMessage().contains("not valid JSON") && e.getMessage().contains("rays"), e.getMessage());
    }

    @Test
    void climateShorthandTextIsTheSource() throws Exception {
        Study s = StudyReader.read(write("s.json", "{\"model\": {\"file\": \"m.obj\"}, " + MIN_SITE + ", \"climate\": \"w.csv\"}"));
        assertEquals(dir.toAbsolutePath().resolve("w.csv"), s.climate().file());
    }

    @Test
    void flagsOverrideTheFileAndErrorsNameTheFlag() throws Exception {
        Path p = write("s.json", FULL);
        Study s = StudyReader.read(p, new StudyOverrides().latitude(10.0).rays(64).sky("perez").climate("clear-sky")
                .out(Path.of("flag-out")));
        assertEquals(10.0, s.site().latitudeDeg());
        assertEquals(16.37, s.site().longitudeDeg());   // from the file
        assertEquals(64, s.rays());
        assertEquals(Perez.INSTANCE, s.sky());
        assertTrue(s.climate().isClearSky());
        assertEquals(ClimateSpec.Format.AUTO, s.climate().format());   // the file's "hourly" is moot for clear-sky
        assertEquals(Path.of("flag-out").toAbsolutePath().normalize(), s.outputs().folder()); // working directory, not the study folder
        InputException e = assertThrows(InputException.class, () -> StudyReader.read(p, new StudyOverrides().latitude(95.0)));
        assertEquals("--lat: expected a number from -90 to 90, got 95.0", e.getMessage());
        Study r = StudyReader.read(p, new StudyOverrides().reflectionRays(1024).maxBounces(3).bounceTolerancePct(0.1));
        assertEquals(new Study.Reflection(0.1, 3, 1024), r.reflection());
        InputException b = assertThrows(InputException.class, () -> StudyReader.read(p, new StudyOverrides().maxBounces(0)));
        assertEquals("--max-bounces: expected a whole number from 1 to 100, got 0", b.getMessage());
    }

    @Test
    void anEmptyListFlagLeavesTheFilesList() throws Exception {
        Study s = StudyReader.read(write("s.json", FULL), new StudyOverrides().analyse(List.of()).context(List.of()));
        assertEquals(List.of("A", "B"), s.model().analyse());
        assertEquals(List.of("C"), s.model().context());
    }

    @Test
    void flagsAloneMakeAStudyAndMissingOnesNameTheFlag() {
        Study s = StudyReader.read(null, new StudyOverrides().model(Path.of("x/model.obj")).latitude(40.0).longitude(-3.7).zone("Europe/Madrid"));
        assertEquals("model", s.name());
        assertNull(s.source());
        assertEquals(Path.of("x/model.obj").toAbsolutePath().normalize(), s.model().file());
        InputException e = assertThrows(InputException.class, () -> StudyReader.read(null, new StudyOverrides().model(Path.of("m.obj")).latitude(40.0).longitude(1.0)));
        assertTrue(e.getMessage().startsWith("--zone: missing"), e.getMessage());
    }

    @Test
    void writtenStudyReadsBackEqual() throws Exception {
        Study s = StudyReader.read(write("s.json", FULL));
        String json = StudyWriter.toJson(s);
        Path again = write("again/written.json", json);
        Study t = StudyReader.read(again);
        assertEquals(new Study(s.name(), s.description(), again.toAbsolutePath().normalize(), s.model(), s.site(), s.climate(),
                s.albedo(), s.groundIrradiance(), s.patchM(), s.rays(), s.sky(), s.timeBase(), s.sunBins(), s.stepMinutes(),
                s.outputs(), s.threads()), t);
        assertEquals(json, StudyWriter.toJson(t));
        assertTrue(json.endsWith("}\n") && !json.contains("\r"));
    }

    @Test
    void fillGapsIsTrueFalseOrAStepCountAndColumnsReadBackEqual() throws Exception {
        String climate = "\"climate\": {\"source\": \"w.csv\", \"format\": \"hourly\", \"fill_gaps\": %s, "
                + "\"columns\": {\"time\": \"Date\", \"ghi\": 2}}";
        Study t = StudyReader.read(write("t.json", "{\"model\": {\"file\": \"m.obj\"}, " + MIN_SITE + ", " + climate.formatted("true") + "}"));
        assertEquals(Climate.FILL_GAPS_STEPS, t.climate().fillGapsMaxSteps());
        assertEquals(Map.of("time", "Date", "ghi", "2"), t.climate().columns());
        assertEquals(Map.of("time", "Date", "ghi", "2"), t.climateSpec().columns());
        Study f = StudyReader.read(write("f.json", "{\"model\": {\"file\": \"m.obj\"}, " + MIN_SITE + ", " + climate.formatted("false") + "}"));
        assertEquals(0, f.climate().fillGapsMaxSteps());
        Study n = StudyReader.read(write("n.json", "{\"model\": {\"file\": \"m.obj\"}, " + MIN_SITE + ", " + climate.formatted("7") + "}"));
        assertEquals(7, n.climateSpec().fillGapsMaxSteps());
        Path again = write("again/n.json", StudyWriter.toJson(n));
        assertEquals(n.climate(), StudyReader.read(again).climate());
        InputException e = fails("{\"model\": {\"file\": \"m.obj\"}, " + MIN_SITE + ", " + climate.formatted("25") + "}");
        assertTrue(e.getMessage().endsWith("climate.fill_gaps: expected a whole number from 0 to 24, got 25"), e.getMessage());
    }

    @Test
    void vegetationKeysGiveTreePatternsAndMonthlyTransmittance() throws Exception {
        String base = "{ \"model\": { \"file\": \"m.obj\" }, \"site\": { \"latitude\": -33.9, \"longitude\": 18.4, \"zone\": \"+02:00\" }";
        Study s = StudyReader.read(write("v1.json", base + ", \"vegetation\": { \"blocks\": [\"tree*\"], \"materials\": [\"leaves\"] } }"));
        assertEquals(java.util.List.of("tree*"), s.vegetation().blockPatterns());
        assertEquals(Vegetation.Kind.DECIDUOUS, s.vegetation().kind());
        // south of the equator the deciduous year is shifted by six months: June is bare, December in leaf
        assertEquals(0.6, s.vegetation().monthly(-33.9)[5]);
        assertEquals(0.25, s.vegetation().monthly(-33.9)[11]);
        Study e = StudyReader.read(write("v2.json", base + ", \"vegetation\": { \"blocks\": [\"pine?\"], \"kind\": \"evergreen\", \"transmittance\": 0.3 } }"));
        assertEquals(0.3, e.vegetation().monthly(10)[0]);
        assertEquals(Vegetation.Kind.EVERGREEN, e.vegetation().kind());
        assertEquals(Vegetation.NONE, StudyReader.read(write("v3.json", base + " }")).vegetation());
        Study t = StudyReader.read(write("v4.json", base + ", \"vegetation\": { \"materials\": [\"leaf*\"], \"transmittance\": [0.6, 0.6, 0.6, 0.4, 0.2, 0.2, 0.2, 0.2, 0.2, 0.4, 0.6, 0.6] } }"));
        assertEquals(t.vegetation(), StudyReader.fromTree(StudyWriter.toTree(t), null, dir, "run.json").vegetation(), "written and read back");
        assertTrue(fails(base + ", \"vegetation\": { \"kind\": \"evergreen\" } }").getMessage().contains("vegetation.blocks or vegetation.materials"));
    }

    /**
     * The reflection bounce limits and the PV system's DC/AC ratio and other DC losses: defaults equal
     * the irradiation and PV stages' constants, given values reach the stages' types, the writer leaves
     * them out at the defaults (earlier results compare byte for byte) and writes given ones so that
     * they read back equal.
     */
    @Test
    void reflectionAndPvSystemKeysReadWriteAndReadBack() throws Exception {
        String base = "{ \"model\": { \"file\": \"m.obj\" }, " + MIN_SITE;
        Study d = StudyReader.read(write("d.json", base + " }"));
        assertEquals(org.solmass.irradiation.IrradiationSetup.DEFAULT_BOUNCE_TOLERANCE, d.reflection().toleranceFraction());
        assertEquals(org.solmass.irradiation.IrradiationSetup.DEFAULT_MAX_BOUNCES, d.reflection().maxBounces());
        assertEquals(1.2, d.pv().layout().dcAcRatio());
        assertEquals(org.solmass.pv.YieldChain.DEFAULT_DC_OTHER_FACTOR, d.pv().layout().dcOtherFactor());
        String written = StudyWriter.toJson(d);
        assertFalse(written.contains("reflection") || written.contains("dc_ac_ratio") || written.contains("other_dc"), written);
        Study s = StudyReader.read(write("r.json", base + ", \"reflection\": { \"tolerance_pct\": 0.1, \"max_bounces\": 3 },"
                + " \"pv\": { \"dc_ac_ratio\": 1.35, \"other_dc_losses_pct\": 7 } }"));
        assertEquals(new Reflection(0.1, 3), s.reflection());
        assertEquals(0.001, s.reflection().toleranceFraction(), 1e-18);
        assertEquals(1.35, s.pv().layout().dcAcRatio());
        assertEquals(0.93, s.pv().layout().dcOtherFactor(), 1e-15);
        assertEquals(1.35, s.pv().layout().yieldChain(true).inverter().dcAcRatio());
        assertEquals(0.93, s.pv().layout().yieldChain(false).dcOtherFactor(), 1e-15);
        Study t = StudyReader.fromTree(StudyWriter.toTree(s), null, dir, "run.json");
        assertEquals(s.reflection(), t.reflection());
        assertEquals(s.pv().layout(), t.pv().layout());
        assertTrue(fails(base + ", \"reflection\": { \"max_bounces\": 101 } }").getMessage()
                .endsWith("reflection.max_bounces: expected a whole number from 1 to 100, got 101"));
        // reflection rays: default, a value that reaches the run's options, a bad one
        assertEquals(org.solmass.irradiation.IrradiationSetup.REFLECTOR_RAYS, d.reflection().rays());
        Study more = StudyReader.read(write("rr.json", base + ", \"reflection\": { \"rays\": 1024 } }"));
        assertEquals(1024, more.reflection().rays());
        assertTrue(StudyWriter.toJson(more).contains("\"rays\" : 1024"), StudyWriter.toJson(more));
        assertEquals(more.reflection(), StudyReader.fromTree(StudyWriter.toTree(more), null, dir, "run.json").reflection());
        assertTrue(fails(base + ", \"reflection\": { \"rays\": 0 } }").getMessage()
                .endsWith("reflection.rays: expected a whole number from 1 to 1048576, got 0"));
        assertTrue(fails(base + ", \"pv\": { \"dc_ac_ratio\": 0.4 } }").getMessage()
                .endsWith("pv.dc_ac_ratio: expected a number from 0.5 to 3, got 0.4"));
    }

    @Test
    void vegetationPatternsMatchWholeNamesWithStarAndQuestionMark() {
        org.solmass.model.MassingModel m = new org.solmass.model.MassingModel(null, java.util.List.of("tree_1", "tree_22", "house", "oak"),
                java.util.List.of("leaves"), new double[9], new int[] {0, 1, 2, 0, 1, 2, 0, 1, 2, 0, 1, 2}, new int[] {0, 1, 2, 3},
                new int[] {-1, -1, -1, 0}, new int[4], 0);
        Vegetation v = new Vegetation(java.util.List.of("tree_?", "hou"), java.util.List.of("leaves"), null, null);
        assertArrayEquals(new boolean[] {true, false, false, true}, v.treeTriangles(m));
        assertEquals(1, v.unmatched(m).size()); // "hou" matches no whole block name
        assertTrue(v.unmatched(m).get(0).startsWith("vegetation.blocks[1]: the pattern \"hou\" matches no block"));
    }
}

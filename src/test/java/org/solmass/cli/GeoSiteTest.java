package org.solmass.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.geo.GeoReference;
import org.solmass.study.Study;
import org.solmass.study.StudyReader;

import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The site of a geo-referenced model: its centre when the study gives none, a warning when they are far apart. */
class GeoSiteTest {
    @TempDir Path dir;

    private Study study(String site) throws Exception {
        Path model = Path.of("sample-geo/footprints.geojson").toAbsolutePath();
        Path s = dir.resolve("s.json");
        Files.writeString(s, "{\"model\": {\"file\": \"" + model + "\"}, \"site\": " + site + "}");
        return StudyReader.read(s);
    }

    @Test
    void siteIsTheModelsCentreWhenTheStudyGivesNone() throws Exception {
        Study s = study("{\"zone\": \"Europe/Berlin\"}");
        GeoReference ref = AnalysisRun.loadModel(s).reference();
        assertEquals(ref.latitudeDeg(), s.site().latitudeDeg(), 0.0);
        assertEquals(ref.longitudeDeg(), s.site().longitudeDeg(), 0.0);
        assertNull(AnalysisRun.siteMismatch(s, ref));
    }

    @Test
    void aSiteMoreThanOneKilometreFromTheModelGivesAWarning() throws Exception {
        Study near = study("{\"latitude\": 48.125, \"longitude\": 9.8065, \"zone\": \"Europe/Berlin\"}"); // ~0.5 km north
        GeoReference ref = AnalysisRun.loadModel(near).reference();
        assertNull(AnalysisRun.siteMismatch(near, ref));
        Study far = study("{\"latitude\": 48.14, \"longitude\": 9.8065, \"zone\": \"Europe/Berlin\"}");   // ~2.2 km north
        String w = AnalysisRun.siteMismatch(far, ref);
        assertNotNull(w);
        assertTrue(w.contains("2.2 km"), w);   // 0.0194 deg x 111.2 km/deg (1 deg of arc on a 6371 km sphere)
    }

    @Test
    void geoKeysSurviveTheResolvedStudy() throws Exception {
        Path model = Path.of("sample-geo/footprints.geojson").toAbsolutePath();
        Path f = dir.resolve("g.json");
        Files.writeString(f, "{\"model\": {\"file\": \"" + model + "\", \"format\": \"geojson\", \"epsg\": 32632,"
                + " \"footprints\": {\"storey_height_m\": 3.5, \"name_property\": \"label\"}},"
                + " \"site\": {\"zone\": \"Europe/Berlin\"}}");
        Study s = StudyReader.read(f);
        assertEquals(32632, s.model().geo().epsg());
        assertEquals(3.5, s.model().geo().storeyHeightM(), 0.0);
        Study back = StudyReader.fromTree(org.solmass.study.StudyWriter.toTree(s), null, dir, "run.json");
        assertEquals(s.model().geo(), back.model().geo());
        assertEquals(s.site(), back.site(), "the site taken from the model is written out");
    }
}

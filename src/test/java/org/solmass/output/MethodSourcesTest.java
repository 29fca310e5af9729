package org.solmass.output;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.climate.ClimateReport;
import org.solmass.study.Study;
import org.solmass.study.StudyOverrides;
import org.solmass.study.StudyReader;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The report's source list names the methods a run used and no other (the run's settings decide). */
class MethodSourcesTest {
    @TempDir Path dir;

    private Study study(StudyOverrides o) throws Exception {
        Path obj = dir.resolve("m.obj");
        Files.writeString(obj, "# stands in for a model file\n");
        return StudyReader.read(null, o.model(obj).latitude(47.0).longitude(8.0).zone("+01:00"));
    }

    @Test
    void isotropicSkyOnAnHourlyGhiOnlyFileNamesLiuJordanAndErbsButNotPerez() throws Exception {
        Path weather = dir.resolve("w.csv");
        Files.writeString(weather, "# stands in for an hourly file that has GHI alone\n");
        Study s = study(new StudyOverrides().sky("isotropic").climate(weather.toString()));
        ClimateReport.Reading r = new ClimateReport.Reading("hourly", "comma", "point", "UTF-8", "LF", false,
                Map.of("time", "time", "ghi", "GHI"), Map.of("ghi", "W/m2"), "", List.of());
        List<String> src = MethodSources.of(s, "hourly-year", new ClimateReport(List.of(), List.of(), r, null, List.of(), null),
                List.of("annual_kwh_m2", "sunshine_h"));
        assertTrue(src.contains(MethodSources.SPA));
        assertTrue(src.contains(MethodSources.LIU_JORDAN_1963));
        assertTrue(src.contains(MethodSources.ERBS), "GHI alone: diffuse by Erbs et al.");
        assertTrue(src.contains(MethodSources.WMO), "sunshine_h: the WMO threshold");
        assertFalse(src.contains(MethodSources.PEREZ), "isotropic sky");
        assertFalse(src.contains(MethodSources.KLEIN), "an hourly year has no average days");
        assertFalse(src.contains(MethodSources.CIE_OVERCAST), "no vsc_pct column");
    }

    @Test
    void clearSkyAverageDaysWithVscNameHottelKleinAndTheOvercastSky() throws Exception {
        Study s = study(new StudyOverrides());
        List<String> src = MethodSources.of(s, "average-days", null, List.of("annual_kwh_m2", "vsc_pct", "sun_level_0321"));
        assertTrue(src.contains(MethodSources.PEREZ), "the default sky");
        assertTrue(src.contains(MethodSources.HOTTEL) && src.contains(MethodSources.LIU_JORDAN_1960), "clear sky");
        assertTrue(src.contains(MethodSources.KLEIN));
        assertTrue(src.contains(MethodSources.CIE_OVERCAST) && src.contains(MethodSources.EN17037));
        assertFalse(src.contains(MethodSources.ERBS));
    }

    @Test
    void pvZonesNameTheirYieldModelsAndNoneWithout() throws Exception {
        Study s = study(new StudyOverrides());
        List<String> with = MethodSources.of(s, "average-days", null, List.of("annual_kwh_m2", "pv_zone"));
        assertTrue(with.contains(MethodSources.MARTIN_RUIZ) && with.contains(MethodSources.FAIMAN)
                && with.contains(MethodSources.IEC_61724), "PV zones: incidence, cell temperature, performance ratio");
        List<String> without = MethodSources.of(s, "average-days", null, List.of("annual_kwh_m2"));
        assertFalse(without.contains(MethodSources.FAIMAN), "no pv_zone column: no PV sources");
    }
}

package org.solmass.output;

import org.solmass.climate.ClimateReport;
import org.solmass.study.Study;

import java.util.ArrayList;
import java.util.Collection;
import java.util.List;

/**
 * The published methods a run used, as a reference list for the report: built from the run's study
 * (sky model, climate source), the climate report (how the file was read) and the result columns it
 * holds, so the list names what was used and nothing else. The same references as docs/method.md,
 * docs/sun-sky-climate.md and docs/metrics.md; titles and page ranges those docs do not give (Liu-Jordan
 * 1960 and 1963, Erbs et al. 1982, Moon-Spencer 1942, Reda-Andreas 2004's title) are from memory.
 */
public final class MethodSources {
    static final String SPA = "Reda, I., Andreas, A. (2004). Solar position algorithm for solar radiation applications. "
            + "Solar Energy 76(5) 577-589 (NREL SPA; sun positions of every step).";
    static final String PEREZ = "Perez, R., Ineichen, P., Seals, R., Michalsky, J., Stewart, R. (1990). Modeling daylight "
            + "availability and irradiance components from direct and global irradiance. Solar Energy 44(5) 271-289, eq. 9 "
            + "(three-part sky diffuse).";
    static final String LIU_JORDAN_1963 = "Liu, B.Y.H., Jordan, R.C. (1963). The long-term average performance of flat-plate "
            + "solar-energy collectors. Solar Energy 7(2) 53-74 (isotropic sky; ground-reflected light of an unobstructed plane).";
    static final String DUFFIE_BECKMAN = "Duffie, J.A., Beckman, W.A. (2013). Solar Engineering of Thermal Processes, 4th ed. "
            + "Wiley (angles of incidence, eq. 1.6.5; extraterrestrial irradiance).";
    static final String KLEIN = "Klein, S.A. (1977). Calculation of monthly average insolation on tilted surfaces. "
            + "Solar Energy 19(4) 325-329 (recommended average days).";
    static final String RADIOSITY = "Howell, J.R., Menguc, M.P., Siegel, R. (2016). Thermal Radiation Heat Transfer, 6th ed., "
            + "ch. 5, 7 and 9 (view factors; diffuse reflection summed bounce by bounce, the Neumann series of the radiosity equations).";
    static final String HOTTEL = "Hottel, H.C. (1976). A simple model for estimating the transmittance of direct solar "
            + "radiation through clear atmospheres. Solar Energy 18(2) 129-134 (clear sky).";
    static final String LIU_JORDAN_1960 = "Liu, B.Y.H., Jordan, R.C. (1960). The interrelationship and characteristic "
            + "distribution of direct, diffuse and total solar radiation. Solar Energy 4(3) 1-19 (diffuse part).";
    static final String COLLARES_RABL = "Collares-Pereira, M., Rabl, A. (1979). The average distribution of solar radiation. "
            + "Solar Energy 22(2) 155-164 (monthly means to hours).";
    static final String ERBS = "Erbs, D.G., Klein, S.A., Duffie, J.A. (1982). Estimation of the diffuse radiation fraction "
            + "for hourly, daily and monthly-average global radiation. Solar Energy 28(4) 293-302 (diffuse from global).";
    static final String WMO = "WMO (2018). Guide to Instruments and Methods of Observation, WMO-No. 8 (sunshine: DNI of at "
            + "least 120 W/m2).";
    static final String EN17037 = "EN 17037:2018 Daylight in buildings (sunlight exposure levels).";
    static final String CIE_OVERCAST = "Moon, P., Spencer, D.E. (1942). Illumination from a non-uniform sky. Illuminating "
            + "Engineering 37, 707-726; ISO 15469:2004 / CIE S 011/E:2003, sky type 16 (CIE standard overcast sky).";

    static final String PEREZ_1993 = "Perez, R., Seals, R., Michalsky, J. (1993). All-weather model for sky luminance "
            + "distribution: preliminary configuration and validation. Solar Energy 50(3) 235-245 (sky radiance distribution).";
    static final String CIE_GENERAL = "ISO 15469:2004 / CIE S 011/E:2003 Spatial distribution of daylight: CIE standard "
            + "general sky (sky radiance distribution).";
    static final String TREGENZA = "Tregenza, P.R. (1987). Subdivision of the sky hemisphere for luminance measurements. "
            + "Lighting Research and Technology 19(1) 13-14 (145 sky patches).";
    static final String MARTIN_RUIZ = "Martin, N., Ruiz, J.M. (2001). Calculation of the PV modules angular losses under field "
            + "conditions by means of an analytical model. Solar Energy Materials and Solar Cells 70(1) 25-38 (incidence-angle losses).";
    static final String FAIMAN = "Faiman, D. (2008). Assessing the outdoor operating temperature of photovoltaic modules. "
            + "Progress in Photovoltaics 16(4) 307-315 (cell temperature).";
    static final String IEC_61724 = "IEC 61724-1:2021 Photovoltaic system performance - Part 1: Monitoring (reference and "
            + "final yield, performance ratio).";

    private MethodSources() {}

    /**
     * @param study the run's study
     * @param timeBase "average-days" or "hourly-year"
     * @param climate the climate report of the run's source, or null when it could not be read again
     * @param columns result columns of patches.csv
     */
    public static List<String> of(Study study, String timeBase, ClimateReport climate, Collection<String> columns) {
        List<String> out = new ArrayList<>();
        out.add(SPA);
        out.add(DUFFIE_BECKMAN);
        if (!"hourly-year".equals(timeBase)) out.add(KLEIN);
        String sky = study.sky().name();
        if ("perez".equals(sky)) out.add(PEREZ);
        if ("perez-1993".equals(sky)) out.add(PEREZ_1993);
        if (sky.startsWith("cie-") && !"cie-overcast".equals(sky)) out.add(CIE_GENERAL);
        if ("perez-1993".equals(sky) || sky.startsWith("cie-")) out.add(TREGENZA);
        out.add(LIU_JORDAN_1963);
        out.add(RADIOSITY);
        if (study.climate().isClearSky()) {
            out.add(HOTTEL);
            out.add(LIU_JORDAN_1960);
        } else if (climate != null && climate.reading() != null) {
            ClimateReport.Reading r = climate.reading();
            if ("monthly".equals(r.format())) {
                out.add(COLLARES_RABL);
                out.add(LIU_JORDAN_1960);
                if (!r.columns().containsKey("dhi")) out.add(ERBS);
            } else if ("hourly".equals(r.format()) && !r.columns().containsKey("dhi") && !r.columns().containsKey("dni")) {
                out.add(ERBS);
            }
        }
        boolean sunLevels = false, sunshine = false, vsc = false, pv = false;
        for (String c : columns) {
            sunLevels |= c.startsWith("sun_level_");
            sunshine |= c.equals("sunshine_h");
            vsc |= c.equals("vsc_pct");
            pv |= c.equals("pv_zone");
        }
        if (sunshine) out.add(WMO);
        if (sunLevels) out.add(EN17037);
        if (vsc || "cie-overcast".equals(sky)) out.add(CIE_OVERCAST);
        if (pv) {
            out.add(MARTIN_RUIZ);
            out.add(FAIMAN);
            out.add(IEC_61724);
        }
        return out;
    }
}

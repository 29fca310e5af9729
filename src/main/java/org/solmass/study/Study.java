package org.solmass.study;

import org.solmass.climate.ClimateSpec;
import org.solmass.climate.TimeBaseChoice;
import org.solmass.model.LengthUnit;
import org.solmass.model.MassingModel;
import org.solmass.model.ModelOptions;
import org.solmass.model.UpAxis;
import org.solmass.sky.SkyModel;
import org.solmass.sun.Site;
import org.solmass.terrain.TerrainSpec;

import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * A resolved study: every option of an analysis with its default applied and every path made
 * absolute. Read from a study file by {@link StudyReader}, with command-line flags laid on top by
 * {@link StudyOverrides}; written back by {@link StudyWriter}. Keys and defaults: docs/study-file.md.
 * Its values are the stages' own types ({@link ModelOptions}' axis and unit, {@link Site},
 * {@link ClimateSpec}'s format and interval label, {@link SkyModel}); where a study value differs from
 * the stage's, the one mapping is here ({@link Model#options()}, {@link #climateSpec()}).
 *
 * @param name study name for titles and reports (default: the study file's or the model's base name)
 * @param description free text kept with the results (e.g. "invented scenario"), may be empty
 * @param source the study file it was read from, absolute; null when built from flags only
 * @param model the massing model and how to read it
 * @param site where the model stands
 * @param climate where the weather comes from
 * @param albedo reflectances of the ground and the blocks
 * @param groundIrradiance whether the ground's irradiance (for ground reflection) is taken unshaded or
 *                         from shaded ground samples
 * @param patchM patch edge length, metres (> 0)
 * @param rays hemisphere rays per patch for the view factors (> 0)
 * @param sky sky diffuse model (one of {@link org.solmass.sky.SkyModels})
 * @param timeBase monthly-average days or an hourly year ({@code AUTO}: from the climate source)
 * @param sunBins number of sky cells the year's sun positions are binned into (hourly year)
 * @param stepMinutes time step of the average days, minutes (divides 60)
 * @param outputs what to write and where
 * @param threads worker threads, 0 = all cores
 * @param sunHours sun hours on given dates (key {@code sun_hours})
 * @param pv PV roof zones (key {@code pv})
 * @param terrain far horizon and DEM terrain (key {@code terrain}; {@link TerrainSpec#NONE}: flat, open)
 * @param vegetation trees that attenuate rays (key {@code vegetation}; {@link Vegetation#NONE} for none)
 * @param reflection when the reflection bounces stop (key {@code reflection})
 */
public record Study(String name, String description, Path source, Model model, Site site, Climate climate, Albedo albedo,
                    GroundIrradiance groundIrradiance, double patchM, int rays, SkyModel sky,
                    TimeBaseChoice timeBase, int sunBins, int stepMinutes, Outputs outputs, int threads,
                    SunHours sunHours, Pv pv, TerrainSpec terrain, Vegetation vegetation, Reflection reflection) {

    public static final double DEFAULT_PATCH_M = 1.0;
    public static final int DEFAULT_RAYS = 1024;
    /** The most rays a study accepts, for {@code rays} and {@code reflection.rays}. */
    public static final int MAX_RAYS = 1 << 20;
    public static final int DEFAULT_SUN_BINS = 4096;
    public static final int DEFAULT_STEP_MINUTES = 60;

    public Study {
        description = description == null ? "" : description;
        albedo = albedo == null ? Albedo.DEFAULTS : albedo;
        outputs = outputs == null ? Outputs.DEFAULTS : outputs;
        climate = climate == null ? Climate.CLEAR_SKY : climate;
        sunHours = sunHours == null ? SunHours.DEFAULTS : sunHours;
        pv = pv == null ? Pv.DEFAULTS : pv;
        terrain = terrain == null ? TerrainSpec.NONE : terrain;
        vegetation = vegetation == null ? Vegetation.NONE : vegetation;
        reflection = reflection == null ? Reflection.DEFAULTS : reflection;
    }

    /** A study with the default reflection bounces. */
    public Study(String name, String description, Path source, Model model, Site site, Climate climate, Albedo albedo,
                 GroundIrradiance groundIrradiance, double patchM, int rays, SkyModel sky,
                 TimeBaseChoice timeBase, int sunBins, int stepMinutes, Outputs outputs, int threads,
                 SunHours sunHours, Pv pv, TerrainSpec terrain, Vegetation vegetation) {
        this(name, description, source, model, site, climate, albedo, groundIrradiance, patchM, rays, sky, timeBase,
                sunBins, stepMinutes, outputs, threads, sunHours, pv, terrain, vegetation, Reflection.DEFAULTS);
    }

    /** A study without terrain (flat ground, open horizon) and without trees. */
    public Study(String name, String description, Path source, Model model, Site site, Climate climate, Albedo albedo,
                 GroundIrradiance groundIrradiance, double patchM, int rays, SkyModel sky,
                 TimeBaseChoice timeBase, int sunBins, int stepMinutes, Outputs outputs, int threads,
                 SunHours sunHours, Pv pv) {
        this(name, description, source, model, site, climate, albedo, groundIrradiance, patchM, rays, sky, timeBase,
                sunBins, stepMinutes, outputs, threads, sunHours, pv, TerrainSpec.NONE, Vegetation.NONE);
    }

    /** A study with the default sun-hour and PV settings. */
    public Study(String name, String description, Path source, Model model, Site site, Climate climate, Albedo albedo,
                 GroundIrradiance groundIrradiance, double patchM, int rays, SkyModel sky,
                 TimeBaseChoice timeBase, int sunBins, int stepMinutes, Outputs outputs, int threads) {
        this(name, description, source, model, site, climate, albedo, groundIrradiance, patchM, rays, sky, timeBase,
                sunBins, stepMinutes, outputs, threads, SunHours.DEFAULTS, Pv.DEFAULTS, TerrainSpec.NONE, Vegetation.NONE);
    }

    /**
     * When the multi-bounce reflection sum stops (key {@code reflection}, docs/study-file.md; method:
     * docs/method.md, {@code irradiation.Reflection}): after the bounce that adds at most
     * {@code tolerancePct} % of the reflected total so far, or after {@code maxBounces} bounces.
     *
     * @param tolerancePct stopping share, percent, in (0, 100]; default 0.5 (our choice)
     * @param maxBounces the most bounces, 1 (one bounce, as before multi-bounce) to {@value #MAX_BOUNCES}; default 20
     * @param rays hemisphere rays that sample reflected light (key {@code rays}): all rays of a
     *             reflector-only receiver and the stratified subset of an analysed patch's rays, at most
     *             the study's {@code rays}; default {@value org.solmass.irradiation.IrradiationSetup#REFLECTOR_RAYS}
     *             (docs/method.md, "Reflection rays": more rays, less noise in reflected light, more time)
     */
    public record Reflection(double tolerancePct, int maxBounces, int rays) {
        /** The largest {@code max_bounces} the study accepts. */
        public static final int MAX_BOUNCES = 100;
        public static final Reflection DEFAULTS = new Reflection(
                100 * org.solmass.irradiation.IrradiationSetup.DEFAULT_BOUNCE_TOLERANCE,
                org.solmass.irradiation.IrradiationSetup.DEFAULT_MAX_BOUNCES,
                org.solmass.irradiation.IrradiationSetup.REFLECTOR_RAYS);

        public Reflection {
            if (!(tolerancePct > 0 && tolerancePct <= 100)) throw new IllegalArgumentException("tolerance must lie in (0, 100] %: " + tolerancePct);
            if (maxBounces < 1 || maxBounces > MAX_BOUNCES) throw new IllegalArgumentException("max bounces must be 1.." + MAX_BOUNCES + ": " + maxBounces);
            if (rays < 1 || rays > MAX_RAYS) throw new IllegalArgumentException("reflection rays must be 1.." + MAX_RAYS + ": " + rays);
        }

        /** With the default reflection rays. */
        public Reflection(double tolerancePct, int maxBounces) {
            this(tolerancePct, maxBounces, org.solmass.irradiation.IrradiationSetup.REFLECTOR_RAYS);
        }

        /** The stopping share as a fraction (the irradiation stage's unit); the default's exact constant when default. */
        public double toleranceFraction() {
            return equals(DEFAULTS) ? org.solmass.irradiation.IrradiationSetup.DEFAULT_BOUNCE_TOLERANCE : tolerancePct / 100;
        }

        public boolean isDefault() { return equals(DEFAULTS); }
    }

    /** The metrics' settings from the study's {@code sun_hours} and {@code pv} keys. */
    public org.solmass.metrics.MetricContext.Settings metricSettings() {
        return new org.solmass.metrics.MetricContext.Settings(sunHours.dates(), sunHours.stepMinutes(), sunHours.minElevationDeg(),
                new org.solmass.metrics.PvZones.Settings(pv.suitablePct(), pv.minZoneM2(), pv.moduleEfficiency(), pv.performanceRatio(),
                        pv.layout(), sunBins));
    }

    /**
     * What the climate stage reads: the clear-sky model in the study's time base, or the file with its
     * format, interval label, column names and gap filling; steps of {@link #stepMinutes}.
     */
    public ClimateSpec climateSpec() {
        Climate c = climate;
        ClimateSpec spec;
        if (c.isClearSky()) {
            spec = timeBase.clearSky(c.year());
        } else {
            spec = ClimateSpec.file(c.file()).withIntervalLabel(c.intervalLabel()).withFormat(c.format())
                    .withColumns(c.columns()).withFillGaps(c.fillGapsMaxSteps()).withReading(c.reading());
        }
        return spec.withStepMinutes(stepMinutes);
    }

    /**
     * Hours of direct sun on given dates (docs/metrics.md).
     *
     * @param dates dates of the study's year (climate.year), each counted from 00:00 to 24:00 local standard time
     * @param stepMinutes minutes between sun positions (divides 60)
     * @param minElevationDeg the sun counts only above this apparent elevation, degrees
     */
    public record SunHours(List<java.time.MonthDay> dates, int stepMinutes, double minElevationDeg) {
        public static final int DEFAULT_STEP_MINUTES = 5;
        /** Our choice (docs/metrics.md): a sun lower than this is usually hidden by trees and terrain. */
        public static final double DEFAULT_MIN_ELEVATION_DEG = 5.0;
        public static final List<java.time.MonthDay> DEFAULT_DATES = List.of(java.time.MonthDay.of(3, 21));
        public static final SunHours DEFAULTS = new SunHours(DEFAULT_DATES, DEFAULT_STEP_MINUTES, DEFAULT_MIN_ELEVATION_DEG);

        public SunHours {
            dates = List.copyOf(dates);
        }
    }

    /**
     * PV zones, layout and yield (docs/metrics.md).
     *
     * @param suitablePct a roof patch is suitable at or above this suitability, percent
     * @param minZoneM2 smallest zone kept, square metres
     * @param moduleEfficiency module efficiency at standard test conditions, 0..1 (that of {@code layout}'s module)
     * @param performanceRatio system performance ratio, 0..1, from plane-of-array irradiation to AC energy
     * @param layout the module and how modules are placed
     */
    public record Pv(double suitablePct, double minZoneM2, double moduleEfficiency, double performanceRatio,
                     org.solmass.pv.LayoutOptions layout) {
        public static final double DEFAULT_SUITABLE_PCT = 80, DEFAULT_MIN_ZONE_M2 = 10,
                DEFAULT_MODULE_EFFICIENCY = org.solmass.pv.ModuleSpec.DEFAULT.efficiency(), DEFAULT_PERFORMANCE_RATIO = 0.80;
        public static final Pv DEFAULTS = new Pv(DEFAULT_SUITABLE_PCT, DEFAULT_MIN_ZONE_M2, DEFAULT_MODULE_EFFICIENCY,
                DEFAULT_PERFORMANCE_RATIO, org.solmass.pv.LayoutOptions.DEFAULTS);

        /** Settings with the default layout. */
        public Pv(double suitablePct, double minZoneM2, double moduleEfficiency, double performanceRatio) {
            this(suitablePct, minZoneM2, moduleEfficiency, performanceRatio, org.solmass.pv.LayoutOptions.DEFAULTS);
        }
    }

    /**
     * The massing model.
     *
     * @param file the OBJ file, absolute
     * @param up which model axis points up
     * @param unit the model's length unit
     * @param northDeg angle from the model's +north axis to true north, degrees clockwise
     * @param analyse names of the blocks to analyse; empty = every block not listed in {@code context}
     * @param context names of blocks that only obstruct (never analysed)
     * @param geo the file's format and CRS and how GeoJSON footprints are extruded (keys
     *            {@code model.format}, {@code model.epsg}, {@code model.footprints}; docs/geo.md)
     */
    public record Model(Path file, UpAxis up, LengthUnit unit, double northDeg, List<String> analyse,
                        List<String> context, org.solmass.geo.GeoOptions geo) {
        public Model {
            analyse = List.copyOf(analyse);
            context = List.copyOf(context);
            if (geo == null) geo = org.solmass.geo.GeoOptions.defaults();
        }

        /** A model whose format is detected and whose CRS, if any, comes from the file. */
        public Model(Path file, UpAxis up, LengthUnit unit, double northDeg, List<String> analyse, List<String> context) {
            this(file, up, unit, northDeg, analyse, context, null);
        }

        /** How the model reader turns the file into metres, x east, y north, z up. */
        public ModelOptions options() { return new ModelOptions(up, unit, northDeg); }

        /** Whether a block of this name is analysed (listed in analyse, or analyse empty), and not context. */
        public boolean isAnalysed(String blockName) {
            if (context.contains(blockName)) return false;
            return analyse.isEmpty() || analyse.contains(blockName);
        }

        /** {@link #isAnalysed} for every block of a model, index = block id. */
        public boolean[] analysedMask(List<String> blockNames) {
            boolean[] m = new boolean[blockNames.size()];
            for (int i = 0; i < m.length; i++) m[i] = isAnalysed(blockNames.get(i));
            return m;
        }
    }

    /**
     * The climate source.
     *
     * @param file the weather file, absolute; null for the embedded clear-sky model
     * @param format kind of the file; {@code AUTO} recognises it from its header
     * @param intervalLabel whether a row's timestamp labels the end or the start of its interval
     * @param fillGapsMaxSteps fill gaps of an hourly file up to this many steps by interpolation instead
     *                         of failing (0 = never)
     * @param year calendar year of the clear-sky hourly year
     * @param columns hourly files: role (time, ghi, dhi, dni, temp) to header name or 1-based column number
     * @param reading what a file cannot say about itself: date order, clock time, irradiance unit
     *                (climate.date_order, climate.clock, climate.irradiance_unit)
     */
    public record Climate(Path file, ClimateSpec.Format format, ClimateSpec.IntervalLabel intervalLabel,
                          int fillGapsMaxSteps, int year, Map<String, String> columns, ClimateSpec.Reading reading) {
        public static final int DEFAULT_YEAR = 2025;
        /** Longest run of missing hourly steps filled for {@code "fill_gaps": true}. */
        public static final int FILL_GAPS_STEPS = 3;
        /** Longest gap {@code fill_gaps} may ask to fill: one day of hourly steps. */
        public static final int MAX_FILL_GAPS_STEPS = 24;
        public static final Climate CLEAR_SKY = new Climate(null, ClimateSpec.Format.AUTO, ClimateSpec.IntervalLabel.START,
                0, DEFAULT_YEAR, Map.of());

        public Climate {
            columns = Map.copyOf(columns);
            reading = reading == null ? ClimateSpec.Reading.DEFAULT : reading;
        }

        public Climate(Path file, ClimateSpec.Format format, ClimateSpec.IntervalLabel intervalLabel,
                       int fillGapsMaxSteps, int year, Map<String, String> columns) {
            this(file, format, intervalLabel, fillGapsMaxSteps, year, columns, ClimateSpec.Reading.DEFAULT);
        }

        public boolean isClearSky() { return file == null; }

        /** Whether gaps of an hourly file are filled. */
        public boolean fillGaps() { return fillGapsMaxSteps > 0; }
    }

    /**
     * Albedo (solar reflectance, 0..1).
     *
     * @param ground the ground around the model (the infinite ground plane and ground faces)
     * @param blocksDefault blocks with no entry of their own
     * @param blocks per block name
     * @param materials per OBJ {@code usemtl} name; wins over the block's value
     */
    public record Albedo(double ground, double blocksDefault, Map<String, Double> blocks,
                         Map<String, Double> materials) {
        public static final double DEFAULT_GROUND = 0.2, DEFAULT_BLOCKS = 0.3;
        public static final Albedo DEFAULTS = new Albedo(DEFAULT_GROUND, DEFAULT_BLOCKS, Map.of(), Map.of());

        public Albedo {
            blocks = Map.copyOf(blocks);
            materials = Map.copyOf(materials);
        }

        /**
         * Albedo of a face: its material's entry, else its block's entry, else {@code blocksDefault}.
         *
         * @param blockName the face's block
         * @param materialName the face's {@code usemtl} name, or null
         */
        public double of(String blockName, String materialName) {
            Double v = entry(blockName, materialName);
            return v != null ? v : blocksDefault;
        }

        /**
         * Albedo of every triangle of a model: its material's entry, else its block's entry, else
         * {@code ground} for a ground triangle and {@code blocksDefault} for the rest.
         *
         * @param groundTriangle per triangle index: whether it belongs to a ground surface
         */
        public float[] perTriangle(MassingModel model, boolean[] groundTriangle) {
            float[] out = new float[model.triangleCount()];
            for (int tr = 0; tr < out.length; tr++) {
                int mi = model.triangleMaterial()[tr];
                Double v = entry(model.blockNames().get(model.triangleBlock()[tr]),
                        mi >= 0 ? model.materialNames().get(mi) : null);
                out[tr] = (float) (v != null ? v : groundTriangle[tr] ? ground : blocksDefault);
            }
            return out;
        }

        /** The material's entry, else the block's entry, else null. */
        private Double entry(String blockName, String materialName) {
            Double m = materialName != null ? materials.get(materialName) : null;
            return m != null ? m : blocks.get(blockName);
        }
    }

    /**
     * What to write.
     *
     * @param folder output folder, absolute
     * @param monthHourCsv write month-hour.csv (large: 12 rows of 24 values per patch)
     * @param map write map.png
     * @param mapWidthPx width of map.png, pixels
     * @param mapHeightPx height of map.png, pixels
     * @param thresholdsKwhM2 annual irradiation thresholds for the "area at or above" figures of
     *                        summary.json, kWh/m2 per year, ascending
     * @param gltf write patches.gltf (glTF 2.0 mesh of the patches)
     * @param storeyHeightM height of the facade storey bands of summary.json, metres
     */
    public record Outputs(Path folder, boolean monthHourCsv, boolean map, int mapWidthPx, int mapHeightPx,
                          List<Double> thresholdsKwhM2, boolean gltf, double storeyHeightM) {
        public static final List<Double> DEFAULT_THRESHOLDS = List.of(300.0, 600.0, 900.0, 1200.0);
        public static final int DEFAULT_MAP_WIDTH = 2000, DEFAULT_MAP_HEIGHT = 1100;
        public static final boolean DEFAULT_GLTF = true;
        /** Common practice: about 3 m floor to floor. */
        public static final double DEFAULT_STOREY_HEIGHT_M = 3.0;
        public static final Outputs DEFAULTS = new Outputs(Path.of("results").toAbsolutePath(), false, true,
                DEFAULT_MAP_WIDTH, DEFAULT_MAP_HEIGHT, DEFAULT_THRESHOLDS, DEFAULT_GLTF, DEFAULT_STOREY_HEIGHT_M);

        public Outputs {
            thresholdsKwhM2 = List.copyOf(thresholdsKwhM2);
        }

        /** Outputs with the default glTF setting. */
        public Outputs(Path folder, boolean monthHourCsv, boolean map, int mapWidthPx, int mapHeightPx,
                       List<Double> thresholdsKwhM2) {
            this(folder, monthHourCsv, map, mapWidthPx, mapHeightPx, thresholdsKwhM2, DEFAULT_GLTF, DEFAULT_STOREY_HEIGHT_M);
        }

        /** Outputs with the default storey height. */
        public Outputs(Path folder, boolean monthHourCsv, boolean map, int mapWidthPx, int mapHeightPx,
                       List<Double> thresholdsKwhM2, boolean gltf) {
            this(folder, monthHourCsv, map, mapWidthPx, mapHeightPx, thresholdsKwhM2, gltf, DEFAULT_STOREY_HEIGHT_M);
        }
    }

    /** Names as written in the study file: lower case, '-' between words. */
    public interface Named {
        String name();

        default String label() { return labelOf((Enum<?>) this); }

        /** Any enum constant's name as written in a study file. */
        static String labelOf(Enum<?> e) { return e.name().toLowerCase(Locale.ROOT).replace('_', '-'); }
    }

    /** Irradiance of the ground that reflects onto the patches. */
    public enum GroundIrradiance implements Named { UNSHADED, SHADED }
}

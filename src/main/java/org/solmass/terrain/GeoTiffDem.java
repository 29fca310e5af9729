package org.solmass.terrain;

import mil.nga.tiff.FieldTagType;
import mil.nga.tiff.FileDirectory;
import mil.nga.tiff.Rasters;
import mil.nga.tiff.TIFFImage;
import mil.nga.tiff.TiffReader;
import org.solmass.InputException;
import org.solmass.TextInput;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;

/**
 * Reads a DEM from a GeoTIFF (single band, any sample type the NGA TIFF library decodes) with its
 * georeferencing: the ModelTiepoint and ModelPixelScale tags (a north-up grid; GeoTIFF 1.1, OGC
 * 19-008r4, 2019, sections 7.3.2 and 7.3.3) and, when present, the GeoKeyDirectory: model type
 * (GTModelTypeGeoKey 1024: projected only), raster type (GTRasterTypeGeoKey 1025: PixelIsArea puts a
 * sample at its pixel's centre, PixelIsPoint at the tie point itself), the projected CRS
 * (ProjectedCSTypeGeoKey 3072, an EPSG code) and its linear unit (ProjLinearUnitsGeoKey 3076:
 * metre, 9001, only). Nodata comes from the GDAL_NODATA tag (42113) and NaN samples.
 */
public final class GeoTiffDem {
    /** Largest grid read, samples (about 256 MB of floats). */
    public static final long MAX_SAMPLES = 64L << 20;
    static final int KEY_MODEL_TYPE = 1024, KEY_RASTER_TYPE = 1025, KEY_GEOGRAPHIC = 2048, KEY_PROJECTED = 3072,
            KEY_LINEAR_UNITS = 3076;
    static final int MODEL_PROJECTED = 1, MODEL_GEOGRAPHIC = 2, RASTER_PIXEL_IS_POINT = 2, UNIT_METRE = 9001,
            USER_DEFINED = 32767;

    private GeoTiffDem() {}

    /**
     * @param file the GeoTIFF
     * @param epsgFallback EPSG code to use when the file declares none (study key), or 0
     * @param fallbackKey the study key of {@code epsgFallback}, for messages
     */
    public static Dem read(Path file, int epsgFallback, String fallbackKey) {
        TextInput.requireRegularFile(file, "file not found, expected a DEM (GeoTIFF)", "a DEM (GeoTIFF) file");
        String name = file.toString();
        TIFFImage image;
        try {
            image = TiffReader.readTiff(file.toFile());
        } catch (IOException | RuntimeException e) {
            throw new InputException(name, "not a readable TIFF file, expected a DEM (GeoTIFF): " + e.getMessage());
        }
        FileDirectory d = image.getFileDirectory();
        List<Double> tie = d.getModelTiepoint(), scale = d.getModelPixelScale();
        if (tie == null || tie.size() < 6 || scale == null || scale.size() < 2) {
            String why = d.get(FieldTagType.ModelTransformation) != null
                    ? "has only a ModelTransformation (a rotated or sheared grid), which is not supported"
                    : "has no georeferencing";
            throw new InputException(name, why + "; expected the GeoTIFF tags ModelTiepoint and ModelPixelScale of a north-up grid");
        }
        double sx = scale.get(0), sy = scale.get(1);
        if (!(sx > 0 && sy > 0 && Double.isFinite(sx) && Double.isFinite(sy))) {
            throw new InputException(name, "ModelPixelScale must be positive (a north-up grid), got " + sx + ", " + sy);
        }
        int epsg = crs(d, name, epsgFallback, fallbackKey);
        boolean point = geoKey(d, KEY_RASTER_TYPE) == RASTER_PIXEL_IS_POINT;
        int w = d.getImageWidth().intValue(), h = d.getImageHeight().intValue();
        if ((long) w * h > MAX_SAMPLES) {
            throw new InputException(name, w + " x " + h + " samples; at most " + MAX_SAMPLES + " are read: cut the DEM to the site");
        }
        if (w < 2 || h < 2) throw new InputException(name, "expected a grid of at least 2 x 2 samples, got " + w + " x " + h);
        double nodata = Double.NaN;
        String nd = d.getStringEntryValue(FieldTagType.GDAL_NODATA);
        if (nd != null && !nd.isBlank()) {
            try {
                nodata = Double.parseDouble(nd.trim().replace("\u0000", ""));
            } catch (NumberFormatException e) {
                throw new InputException(name, "GDAL_NODATA tag: expected a number, got \"" + nd.trim() + "\"");
            }
        }
        Rasters r;
        try {
            r = d.readRasters();
        } catch (RuntimeException e) {
            throw new InputException(name, "the samples cannot be decoded: " + e.getMessage());
        }
        float[] z = new float[w * h];
        for (int row = 0; row < h; row++) {
            for (int col = 0; col < w; col++) {
                double v = r.getFirstPixelSample(col, row).doubleValue();
                z[row * w + col] = v == nodata || !Double.isFinite(v) ? Float.NaN : (float) v;
            }
        }
        double half = point ? 0 : 0.5;
        double x0 = tie.get(3) + (half - tie.get(0)) * sx, y0 = tie.get(4) - (half - tie.get(1)) * sy;
        return new Dem(name, w, h, z, x0, y0, sx, sy, epsg);
    }

    /** The EPSG code of the grid's projected CRS; refuses geographic grids and units other than metres. */
    private static int crs(FileDirectory d, String name, int fallback, String fallbackKey) {
        if (d.get(FieldTagType.GeoKeyDirectory) == null) {
            if (fallback > 0) return fallback;
            throw new InputException(name, "declares no coordinate system (no GeoKeyDirectory tag); give its EPSG code in " + fallbackKey);
        }
        int model = geoKey(d, KEY_MODEL_TYPE);
        if (model == MODEL_GEOGRAPHIC) {
            int g = geoKey(d, KEY_GEOGRAPHIC);
            throw new InputException(name, "is in geographic coordinates (degrees" + (g > 0 && g != USER_DEFINED ? ", EPSG:" + g : "")
                    + "); expected a projected grid in metres (reproject it, e.g. to its UTM zone)");
        }
        int unit = geoKey(d, KEY_LINEAR_UNITS);
        if (unit > 0 && unit != UNIT_METRE) {
            throw new InputException(name, "linear unit code " + unit + " (ProjLinearUnitsGeoKey); expected metres (9001)");
        }
        int p = geoKey(d, KEY_PROJECTED);
        if (p > 0 && p != USER_DEFINED) return p;
        if (fallback > 0) return fallback;
        if (model == MODEL_PROJECTED || unit == UNIT_METRE) return 0; // projected, in metres, code not given
        throw new InputException(name, "declares no projected coordinate system (ProjectedCSTypeGeoKey); give its EPSG code in " + fallbackKey);
    }

    /** A SHORT-valued key of the GeoKeyDirectory (stored in the directory itself), or -1 when absent. */
    static int geoKey(FileDirectory d, int key) {
        List<Integer> k = d.getIntegerListEntryValue(FieldTagType.GeoKeyDirectory);
        if (k == null || k.size() < 4) return -1;
        int n = k.get(3);
        for (int i = 0; i < n && 4 + 4 * i + 3 < k.size(); i++) {
            int at = 4 + 4 * i;
            if (k.get(at) == key && k.get(at + 1) == 0) return k.get(at + 3);
        }
        return -1;
    }
}

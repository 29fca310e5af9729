package org.solmass.terrain;

import mil.nga.tiff.FieldTagType;
import mil.nga.tiff.FieldType;
import mil.nga.tiff.FileDirectory;
import mil.nga.tiff.Rasters;
import mil.nga.tiff.TIFFImage;
import mil.nga.tiff.TiffWriter;
import mil.nga.tiff.util.TiffConstants;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.List;
import java.util.function.BiFunction;

/**
 * Small GeoTIFF DEMs with invented heights, written with the NGA TIFF library (the library the
 * reader uses) and the GeoTIFF 1.1 tags (OGC 19-008r4): ModelTiepoint, ModelPixelScale,
 * GeoKeyDirectory, GDAL_NODATA.
 */
public final class GeoTiffFixture {
    private int width = 3, height = 3;
    private double originX, originY, cell = 1;
    private BiFunction<Double, Double, Double> z = (x, y) -> 0.0;
    private boolean georeferenced = true;
    private int[] geoKeys = {1024, 1, 1025, 1, 3072, 25832, 3076, 9001}; // projected, PixelIsArea, EPSG:25832, metre
    private Double nodata;

    /** A grid of w x h pixels of {@code cell} metres whose north-west corner is at (x0, y0). */
    public GeoTiffFixture grid(int w, int h, double x0, double y0, double cellM) {
        width = w; height = h; originX = x0; originY = y0; cell = cellM;
        return this;
    }

    /** Heights as a function of the pixel centre's easting and northing; NaN writes the nodata value. */
    public GeoTiffFixture heights(BiFunction<Double, Double, Double> f) { z = f; return this; }

    public GeoTiffFixture noGeoreferencing() { georeferenced = false; return this; }

    /** GeoKeys as (key, value) pairs, all stored in the directory; empty: no GeoKeyDirectory tag. */
    public GeoTiffFixture geoKeys(int... pairs) { geoKeys = pairs; return this; }

    public GeoTiffFixture nodata(double v) { nodata = v; return this; }

    /** Easting of the centre of pixel column i. */
    public double x(int i) { return originX + (i + 0.5) * cell; }

    /** Northing of the centre of pixel row j. */
    public double y(int j) { return originY - (j + 0.5) * cell; }

    public byte[] bytes() {
        Rasters r = new Rasters(width, height, 1, FieldType.FLOAT);
        for (int j = 0; j < height; j++) {
            for (int i = 0; i < width; i++) {
                double v = z.apply(x(i), y(j));
                r.setFirstPixelSample(i, j, (float) (Double.isNaN(v) && nodata != null ? nodata : v));
            }
        }
        FileDirectory d = new FileDirectory();
        d.setImageWidth(width);
        d.setImageHeight(height);
        d.setBitsPerSample(FieldType.FLOAT.getBits());
        d.setCompression(TiffConstants.COMPRESSION_NO);
        d.setPhotometricInterpretation(TiffConstants.PHOTOMETRIC_INTERPRETATION_BLACK_IS_ZERO);
        d.setSamplesPerPixel(1);
        d.setRowsPerStrip(r.calculateRowsPerStrip(TiffConstants.PLANAR_CONFIGURATION_CHUNKY));
        d.setPlanarConfiguration(TiffConstants.PLANAR_CONFIGURATION_CHUNKY);
        d.setSampleFormat(TiffConstants.SAMPLE_FORMAT_FLOAT);
        d.setWriteRasters(r);
        if (georeferenced) {
            d.setModelTiepoint(List.of(0.0, 0.0, 0.0, originX, originY, 0.0));
            d.setModelPixelScale(List.of(cell, cell, 0.0));
        }
        if (geoKeys.length > 0) {
            List<Integer> k = new ArrayList<>(List.of(1, 1, 0, geoKeys.length / 2));
            for (int i = 0; i < geoKeys.length; i += 2) k.addAll(List.of(geoKeys[i], 0, 1, geoKeys[i + 1]));
            d.setUnsignedIntegerListEntryValue(FieldTagType.GeoKeyDirectory, k);
        }
        if (nodata != null) d.setStringEntryValue(FieldTagType.GDAL_NODATA, String.valueOf(nodata));
        try {
            return TiffWriter.writeTiffToBytes(new TIFFImage(d));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}

package org.solmass.output;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.*;

class RasterTest {
    private static final int[] SQUARE = {0, 1, 2, 0, 2, 3};

    private static int count(Raster r, int colour) {
        int n = 0;
        for (int c : r.rgb) if (c == colour) n++;
        return n;
    }

    @Test
    void concavePolygonCoversItsAreaInPixels() {
        // An L shape of area 200*200 - 100*100 = 30000 px^2; pixel-centre sampling misses or adds at
        // most the pixels the boundary passes through (geometry: perimeter 800 px), and ear clipping
        // must not fill the notch.
        Raster r = new Raster(300, 300, 0xFFFFFF);
        double[] xs = {20, 220, 220, 120, 120, 20}, ys = {20, 20, 120, 120, 220, 220}, zs = new double[6];
        r.polygon(xs, ys, zs, org.solmass.model.PolygonTriangulator.triangulate(xs, ys), 0x123456, 0);
        int n = count(r, 0x123456);
        assertEquals(30000, n, 800);
        assertNotEquals(0x123456, r.rgb[170 * 300 + 170], "the notch stays empty");
        assertEquals(0x123456, r.rgb[170 * 300 + 70]);
        assertEquals(0x123456, r.rgb[70 * 300 + 170]);
    }

    @Test
    void nearerSurfaceWinsWhateverTheDrawingOrder() {
        for (int order = 0; order < 2; order++) {
            Raster r = new Raster(100, 100, 0xFFFFFF);
            double[] xs = {10, 90, 90, 10}, ys = {10, 10, 90, 90};
            double[] near = {5, 5, 5, 5}, far = {1, 1, 1, 1};
            if (order == 0) {
                r.polygon(xs, ys, far, SQUARE, 0xFF0000, 0);
                r.polygon(xs, ys, near, SQUARE, 0x00FF00, 0);
            } else {
                r.polygon(xs, ys, near, SQUARE, 0x00FF00, 0);
                r.polygon(xs, ys, far, SQUARE, 0xFF0000, 0);
            }
            assertEquals(0x00FF00, r.rgb[50 * 100 + 50]);
        }
    }

    @Test
    void downsamplingAveragesTwoByTwoBlocks() {
        Raster r = new Raster(2, 2, 0x000000);
        r.rgb[0] = 0xFFFFFF;
        r.rgb[3] = 0xFFFFFF;
        assertArrayEquals(new int[] {0x808080}, r.downsample2());   // (255+255+0+0+2)/4 = 128
    }
}

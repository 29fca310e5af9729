package org.solmass.geo;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.surface.Surface;
import org.solmass.surface.SurfaceBuilder;
import org.solmass.surface.SurfaceKind;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;

/** An invented LoD1 block (a gml:Solid, no thematic surfaces): its faces are classified by their normals. */
class CityGmlLod1Test {
    @TempDir Path dir;

    /** The six faces of a 20 x 10 x 15 m box, each counter-clockwise seen from outside. */
    static String box() {
        double[][] p = {{0, 0, 0}, {20, 0, 0}, {20, 10, 0}, {0, 10, 0}, {0, 0, 15}, {20, 0, 15}, {20, 10, 15}, {0, 10, 15}};
        int[][] faces = {{0, 3, 2, 1}, {4, 5, 6, 7}, {0, 1, 5, 4}, {1, 2, 6, 5}, {2, 3, 7, 6}, {3, 0, 4, 7}};
        StringBuilder sb = new StringBuilder();
        for (int[] f : faces) {
            sb.append("<gml:surfaceMember><gml:Polygon><gml:exterior><gml:LinearRing><gml:posList>");
            for (int k = 0; k <= 4; k++) {
                double[] c = p[f[k % 4]];
                sb.append(' ').append(500000 + c[0]).append(' ').append(5000000 + c[1]).append(' ').append(c[2]);
            }
            sb.append("</gml:posList></gml:LinearRing></gml:exterior></gml:Polygon></gml:surfaceMember>\n");
        }
        return """
                <?xml version="1.0" encoding="UTF-8"?>
                <!-- invented LoD1 block -->
                <core:CityModel xmlns:core="http://www.opengis.net/citygml/2.0" xmlns:bldg="http://www.opengis.net/citygml/building/2.0"
                    xmlns:gml="http://www.opengis.net/gml">
                  <core:cityObjectMember><bldg:Building gml:id="block-7"><bldg:lod1Solid>
                    <gml:Solid srsName="EPSG:25833"><gml:exterior><gml:CompositeSurface>
                """ + sb + """
                    </gml:CompositeSurface></gml:exterior></gml:Solid>
                  </bldg:lod1Solid></bldg:Building></core:cityObjectMember>
                </core:CityModel>
                """;
    }

    @Test
    void lod1SolidFacesAreClassifiedByTheirNormals() throws Exception {
        Path f = dir.resolve("block.gml");
        Files.writeString(f, box());
        GeoModel g = CityGmlReader.read(f, GeoOptions.defaults());
        assertEquals(List.of("block-7"), g.model().blockNames());
        assertEquals(25833, g.reference().file().epsg());
        Map<SurfaceKind, Double> area = new EnumMap<>(SurfaceKind.class);
        for (Surface s : SurfaceBuilder.build(g.model())) area.merge(s.kind(), s.areaM2(), Double::sum);
        assertEquals(200.0, area.get(SurfaceKind.ROOF), 1e-6);                  // 20 x 10
        assertEquals(2 * (20 + 10) * 15.0, area.get(SurfaceKind.FACADE), 1e-6);  // perimeter x height
        assertEquals(200.0, area.get(SurfaceKind.UNDERSIDE), 1e-6);             // the floor faces down
    }
}

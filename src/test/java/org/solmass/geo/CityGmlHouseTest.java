package org.solmass.geo;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.solmass.model.MassingModel;
import org.solmass.surface.Surface;
import org.solmass.surface.SurfaceBuilder;
import org.solmass.surface.SurfaceKind;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * The invented LoD2 gabled house (sample-geo/make_house.py) in CityGML 2.0 and 3.0: every surface
 * Solmass builds has the kind, area and tilt of the file's polygon, computed here from the posList
 * text alone (Newell's method for the plane normal and area: Sutherland, Sproull and Schumacker,
 * 1974, ACM Computing Surveys 6(1)).
 */
class CityGmlHouseTest {
    static final Pattern SURFACE = Pattern.compile(
            "<(?:bldg|con):(RoofSurface|WallSurface|GroundSurface) gml:id=\"[^\"]+\">.*?<gml:posList[^>]*>([^<]+)</gml:posList>",
            Pattern.DOTALL);

    /** kind, area m2, tilt deg of each polygon in the file. */
    record Expected(SurfaceKind kind, double areaM2, double tiltDeg) {}

    static List<Expected> fromFile(Path file) throws Exception {
        Matcher m = SURFACE.matcher(Files.readString(file));
        List<Expected> out = new ArrayList<>();
        while (m.find()) {
            String[] t = m.group(2).trim().split("\\s+");
            int n = t.length / 3 - 1;   // the ring repeats its first corner
            double nx = 0, ny = 0, nz = 0;
            for (int i = 0; i < n; i++) {
                int j = (i + 1) % n;
                double xi = Double.parseDouble(t[3 * i]), yi = Double.parseDouble(t[3 * i + 1]), zi = Double.parseDouble(t[3 * i + 2]);
                double xj = Double.parseDouble(t[3 * j]), yj = Double.parseDouble(t[3 * j + 1]), zj = Double.parseDouble(t[3 * j + 2]);
                nx += (yi - yj) * (zi + zj);
                ny += (zi - zj) * (xi + xj);
                nz += (xi - xj) * (yi + yj);
            }
            double len = Math.sqrt(nx * nx + ny * ny + nz * nz);
            SurfaceKind k = switch (m.group(1)) {
                case "RoofSurface" -> SurfaceKind.ROOF;
                case "WallSurface" -> SurfaceKind.FACADE;
                default -> SurfaceKind.UNDERSIDE;   // the building's floor on the ground faces down
            };
            out.add(new Expected(k, len / 2, Math.toDegrees(Math.acos(nz / len))));
        }
        return out;
    }

    @ParameterizedTest
    @ValueSource(strings = {"sample-geo/gabled-house.gml", "src/test/resources/org/solmass/geo/gabled-house-3.0.gml"})
    void surfacesKeepTheFilesKindsAreasAndTilts(String path) throws Exception {
        Path file = Path.of(path);
        GeoModel g = CityGmlReader.read(file, GeoOptions.defaults());
        MassingModel m = g.model();
        assertEquals(List.of("house-1"), m.blockNames(), "the building's gml:id names the block");
        assertEquals(25832, g.reference().file().epsg(), "the first EPSG code of the compound srsName");
        List<Expected> want = new ArrayList<>(fromFile(file));
        assertEquals(7, want.size());
        List<Surface> got = new ArrayList<>(SurfaceBuilder.build(m));
        Comparator<Object[]> order = Comparator.<Object[], String>comparing(o -> o[0].toString())
                .thenComparingDouble(o -> (double) o[2]).thenComparingDouble(o -> (double) o[1]);
        List<Object[]> a = new ArrayList<>(), b = new ArrayList<>();
        for (Expected e : want) a.add(new Object[]{e.kind(), e.areaM2(), e.tiltDeg()});
        for (Surface s : got) b.add(new Object[]{s.kind(), s.areaM2(), s.tiltDeg()});
        a.sort(order);
        b.sort(order);
        assertEquals(a.size(), b.size(), "one surface per polygon");
        for (int i = 0; i < a.size(); i++) {
            assertEquals(a.get(i)[0], b.get(i)[0], "kind of surface " + i);
            assertEquals((double) a.get(i)[1], (double) b.get(i)[1], 1e-6, "area of the " + a.get(i)[0] + " surface");
            assertEquals((double) a.get(i)[2], (double) b.get(i)[2], 1e-6, "tilt of the " + a.get(i)[0] + " surface");
        }
        // the roof's tilt is atan(rise 3 m / run 4 m) = 36.87 deg (a 3-4-5 triangle)
        assertEquals(Math.toDegrees(Math.atan2(3, 4)), (double) b.stream().filter(o -> o[0] == SurfaceKind.ROOF)
                .findFirst().orElseThrow()[2], 1e-6);
    }
}

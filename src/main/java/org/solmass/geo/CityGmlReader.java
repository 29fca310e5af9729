package org.solmass.geo;

import org.citygml4j.core.model.building.AbstractBuilding;
import org.citygml4j.core.model.building.Building;
import org.citygml4j.core.model.building.BuildingPartProperty;
import org.citygml4j.core.model.construction.GroundSurface;
import org.citygml4j.core.model.construction.OuterCeilingSurface;
import org.citygml4j.core.model.construction.OuterFloorSurface;
import org.citygml4j.core.model.construction.RoofSurface;
import org.citygml4j.core.model.construction.WallSurface;
import org.citygml4j.core.model.core.AbstractCityObject;
import org.citygml4j.core.model.core.AbstractCityObjectProperty;
import org.citygml4j.core.model.core.AbstractFeature;
import org.citygml4j.core.model.core.AbstractSpaceBoundary;
import org.citygml4j.core.model.core.AbstractSpaceBoundaryProperty;
import org.citygml4j.core.model.core.AbstractThematicSurface;
import org.citygml4j.core.model.core.CityModel;
import org.citygml4j.xml.CityGMLContext;
import org.citygml4j.xml.reader.CityGMLReader;
import org.solmass.InputException;
import org.solmass.model.SemanticKind;
import org.xmlobjects.gml.model.geometry.AbstractGeometry;
import org.xmlobjects.gml.model.geometry.GeometryProperty;
import org.xmlobjects.gml.model.geometry.SRSReference;
import org.xmlobjects.gml.model.geometry.primitives.AbstractRingProperty;
import org.xmlobjects.gml.model.geometry.primitives.Polygon;
import org.xmlobjects.gml.visitor.GeometryWalker;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * Reads the buildings of a CityGML 1.0, 2.0 or 3.0 file (citygml4j 3) in LoD1 or LoD2.
 *
 * <p>Per building (and per building part, each a block of its own): the polygons of its thematic
 * boundary surfaces (LoD2, else LoD3, else LoD1 multi-surface of each), with the kind the file
 * declares: RoofSurface, WallSurface, GroundSurface, OuterCeilingSurface, OuterFloorSurface
 * ({@link SemanticKind}; a ClosureSurface or another boundary is classified by its normal). A
 * building with no boundary surfaces gives the polygons of its LoD2 solid, else its LoD2
 * multi-surface, else its LoD1 solid, classified by their normals.
 * Block name: the gml:id, else the first gml:name, else "building N" (N in file order; a name used
 * before gets "#N" appended). Other city objects (terrain, vegetation, ...) are skipped with one warning.
 *
 * <p>CRS: {@code model.epsg} when given; else the srsName of the geometries (inherited from their
 * parents) or of the city model's envelope. A file that names no CRS, or one that is not an EPSG
 * code, is refused: the unit of its coordinates is unknown. A geographic CRS's positions are read
 * in the EPSG axis order, latitude first.
 */
public final class CityGmlReader {
    private CityGmlReader() {}

    private record Pending(String block, SemanticKind kind, int feature, List<double[]> rings) {}

    /** Reads a CityGML file. */
    public static GeoModel read(Path file, GeoOptions options) {
        org.solmass.TextInput.requireRegularFile(file, "file not found, expected a CityGML model", "a CityGML model");
        String name = file.toString();
        List<Pending> polys = new ArrayList<>();
        List<String> srs = new ArrayList<>();
        int[] skipped = {0};
        int[] buildings = {0};
        try (var in = Files.newInputStream(file)) {
            CityGMLContext context = CityGMLContext.newInstance(CityGmlReader.class.getClassLoader());
            // no DTDs and no external entities: a model file cannot make the reader fetch or include other files
            javax.xml.stream.XMLInputFactory xml = javax.xml.stream.XMLInputFactory.newFactory();
            xml.setProperty(javax.xml.stream.XMLInputFactory.SUPPORT_DTD, false);
            xml.setProperty(javax.xml.stream.XMLInputFactory.IS_SUPPORTING_EXTERNAL_ENTITIES, false);
            try (CityGMLReader reader = context.createCityGMLInputFactory(xml).createCityGMLReader(in)) {
                while (reader.hasNext()) {
                    AbstractFeature f = reader.next();
                    if (f instanceof CityModel cm) {
                        if (cm.getBoundedBy() != null && cm.getBoundedBy().getEnvelope() != null) {
                            String s = cm.getBoundedBy().getEnvelope().getSrsName();
                            if (s != null) srs.add(s);
                        }
                        for (AbstractCityObjectProperty p : cm.getCityObjectMembers()) {
                            AbstractCityObject o = p.getObject();
                            if (o instanceof AbstractBuilding b) building(b, ++buildings[0], polys, srs, null);
                            else skipped[0]++;
                        }
                    } else if (f instanceof AbstractBuilding b) {
                        building(b, ++buildings[0], polys, srs, null);
                    } else {
                        skipped[0]++;
                    }
                }
            }
        } catch (java.nio.file.NoSuchFileException e) {
            throw new InputException(name, "file not found, expected a CityGML model", e);
        } catch (InputException e) {
            throw e;
        } catch (Exception e) {
            String msg = e.getMessage();
            for (Throwable c = e.getCause(); c != null; c = c.getCause()) if (c.getMessage() != null) msg = c.getMessage();
            throw new InputException(name, "cannot read the CityGML file: " + msg, e);
        }
        if (polys.isEmpty()) {
            throw new InputException(name, "no building with LoD1 or LoD2 polygons found (" + buildings[0]
                    + " building(s), " + skipped[0] + " other city object(s)); expected bldg:Building features");
        }
        Crs crs = crs(name, srs, options);
        GeoModelBuilder b = new GeoModelBuilder(name, file);
        List<String> warnings = new ArrayList<>();
        if (skipped[0] > 0) warnings.add(name + ": " + skipped[0] + " city object(s) that are not buildings skipped");
        java.util.Map<String, String> blockOfBuilding = new java.util.HashMap<>();
        for (Pending p : polys) {
            if (crs.geographic()) for (double[] r : p.rings) swapAxes(r);
            String key = p.feature + "\u0000" + p.block;
            String block = blockOfBuilding.computeIfAbsent(key, k -> b.hasBlock(p.block) ? p.block + "#" + p.feature : p.block);
            b.polygon(b.block(block), p.kind, p.feature, p.rings);
        }
        return b.build(crs, warnings);
    }

    private static void swapAxes(double[] r) {
        for (int i = 0; i + 1 < r.length; i += 3) { double t = r[i]; r[i] = r[i + 1]; r[i + 1] = t; }
    }

    private static Crs crs(String name, List<String> srs, GeoOptions options) {
        String named = srs.isEmpty() ? null : srs.get(0);
        int fromFile = Srs.epsgOf(named);
        if (options.epsg() > 0) {
            if (fromFile > 0 && fromFile != options.epsg()) {
                throw new InputException(name, "the file says srsName \"" + named + "\" but model.epsg says EPSG:"
                        + options.epsg() + "; drop one of them");
            }
            return Crs.epsg(options.epsg(), "model.epsg");
        }
        if (named == null) {
            throw new InputException(name, "the file declares no coordinate reference system (no srsName), so the"
                    + " unit and place of its coordinates are unknown; give its EPSG code (model.epsg, --epsg)");
        }
        if (fromFile == 0) {
            throw new InputException(name, "srsName \"" + named + "\" names no EPSG code, so the unit and place of"
                    + " the coordinates are unknown; give the EPSG code (model.epsg, --epsg)");
        }
        return Crs.epsg(fromFile, name + ": srsName \"" + named + "\"");
    }

    private static void building(AbstractBuilding b, int number, List<Pending> out, List<String> srs, String parent) {
        String block = b.getId();
        if (block == null || block.isBlank()) {
            block = b.getNames() != null && !b.getNames().isEmpty() && b.getNames().get(0).getValue() != null
                    ? b.getNames().get(0).getValue() : parent == null ? "building " + number : parent + "/part";
        }
        int before = out.size();
        for (AbstractSpaceBoundaryProperty p : b.getBoundaries()) {
            AbstractSpaceBoundary s = p.getObject();
            if (!(s instanceof AbstractThematicSurface t)) continue;
            GeometryProperty<?> g = t.getLod2MultiSurface() != null ? t.getLod2MultiSurface()
                    : t.getLod3MultiSurface() != null ? t.getLod3MultiSurface() : t.getLod1MultiSurface();
            collect(g, block, kindOf(s), number, out, srs);
        }
        if (out.size() == before) {
            GeometryProperty<?>[] tries = {b.getLod2Solid(), b.getLod2MultiSurface(), b.getLod1Solid()};
            for (GeometryProperty<?> g : tries) {
                if (g == null || out.size() > before) continue;
                collect(g, block, SemanticKind.NONE, number, out, srs);
            }
        }
        if (b instanceof Building bb) {
            for (BuildingPartProperty pp : bb.getBuildingParts()) {
                if (pp.getObject() != null) building(pp.getObject(), number, out, srs, block);
            }
        }
    }

    private static SemanticKind kindOf(AbstractSpaceBoundary s) {
        if (s instanceof RoofSurface) return SemanticKind.ROOF;
        if (s instanceof WallSurface) return SemanticKind.WALL;
        if (s instanceof GroundSurface) return SemanticKind.GROUND;
        if (s instanceof OuterCeilingSurface) return SemanticKind.OUTER_CEILING;
        if (s instanceof OuterFloorSurface) return SemanticKind.OUTER_FLOOR;
        return SemanticKind.NONE;
    }

    private static void collect(GeometryProperty<?> g, String block, SemanticKind kind, int number,
                                List<Pending> out, List<String> srs) {
        if (g == null || g.getObject() == null) return;
        AbstractGeometry geom = g.getObject();
        geom.accept(new GeometryWalker() {
            @Override
            public void visit(Polygon p) {
                if (p.getExterior() == null || p.getExterior().getObject() == null) return;
                SRSReference ref = p.getInheritedSRSReference();
                if (ref != null && ref.getSrsName() != null) srs.add(ref.getSrsName());
                List<double[]> rings = new ArrayList<>();
                rings.add(coords(p.getExterior()));
                for (AbstractRingProperty r : p.getInterior()) if (r.getObject() != null) rings.add(coords(r));
                if (rings.get(0).length >= 9) out.add(new Pending(block, kind, number, rings));
            }
        });
    }

    private static double[] coords(AbstractRingProperty r) {
        List<Double> c = r.getObject().toCoordinateList3D();
        double[] out = new double[c.size()];
        for (int i = 0; i < out.length; i++) out[i] = c.get(i);
        return out;
    }
}

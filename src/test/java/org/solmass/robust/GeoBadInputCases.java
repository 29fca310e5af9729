package org.solmass.robust;

import java.util.List;
import java.util.Map;

/**
 * The bad geo-referenced models of docs/bad-inputs.md ("Geo-referenced models"): invented GeoJSON
 * and CityGML files in UTM zone 32N, analysed with only a time zone (the site comes from the model).
 */
final class GeoBadInputCases {
    private GeoBadInputCases() {}

    /** A FeatureCollection with one feature of the given properties and ring, and an optional crs member. */
    static String geojson(String crsName, String properties, String ring) {
        String crs = crsName == null ? "" : "\"crs\": {\"type\": \"name\", \"properties\": {\"name\": \"" + crsName + "\"}},\n";
        return "{\"type\": \"FeatureCollection\",\n" + crs + "\"features\": [\n"
                + "{\"type\": \"Feature\", \"properties\": " + properties + ",\n"
                + " \"geometry\": {\"type\": \"Polygon\", \"coordinates\": [" + ring + "]}}\n]}\n";
    }

    static final String SQUARE = "[[560000, 5330000], [560010, 5330000], [560010, 5330010], [560000, 5330010], [560000, 5330000]]";
    static final String BOW_TIE = "[[560000, 5330000], [560010, 5330010], [560010, 5330000], [560000, 5330010], [560000, 5330000]]";
    static final String UTM = "urn:ogc:def:crs:EPSG::32632";

    /** A CityGML 2.0 building with one LoD2 roof polygon and no srsName anywhere. */
    static final String CITYGML_NO_SRS = """
            <?xml version="1.0" encoding="UTF-8"?>
            <core:CityModel xmlns:core="http://www.opengis.net/citygml/2.0" xmlns:bldg="http://www.opengis.net/citygml/building/2.0"
                xmlns:gml="http://www.opengis.net/gml">
              <core:cityObjectMember><bldg:Building gml:id="b1">
                <bldg:boundedBy><bldg:RoofSurface gml:id="r1"><bldg:lod2MultiSurface><gml:MultiSurface><gml:surfaceMember>
                  <gml:Polygon><gml:exterior><gml:LinearRing><gml:posList srsDimension="3">
                    560000 5330000 6 560010 5330000 6 560010 5330010 6 560000 5330010 6 560000 5330000 6
                  </gml:posList></gml:LinearRing></gml:exterior></gml:Polygon>
                </gml:surfaceMember></gml:MultiSurface></bldg:lod2MultiSurface></bldg:RoofSurface></bldg:boundedBy>
              </bldg:Building></core:cityObjectMember>
            </core:CityModel>
            """;

    private static String[] analyse(String model) {
        return new String[]{"analyse", "-q", "--model", "@" + model, "--zone", "Europe/Berlin", "--rays", "16", "--out", "@out"};
    }

    static void addTo(Map<String, BadInputCases.Case> cases) {
        for (var e : List.of(
                Map.entry("geojson-footprint-no-height", geojson(UTM, "{\"name\": \"B\"}", SQUARE)),
                Map.entry("geojson-self-intersecting-footprint", geojson(UTM, "{\"name\": \"B\", \"height\": 9}", BOW_TIE)),
                Map.entry("geojson-unknown-epsg", geojson("urn:ogc:def:crs:EPSG::99999", "{\"height\": 9}", SQUARE)),
                Map.entry("geojson-crs-without-unit", geojson("urn:x-local:site-grid", "{\"height\": 9}", SQUARE)),
                Map.entry("geojson-projected-without-crs", geojson(null, "{\"height\": 9}", SQUARE)))) {
            cases.put(e.getKey(), new BadInputCases.Case(Map.of("m.geojson", e.getValue()), analyse("m.geojson")));
        }
        cases.put("citygml-without-crs", new BadInputCases.Case(Map.of("m.gml", CITYGML_NO_SRS), analyse("m.gml")));
    }
}

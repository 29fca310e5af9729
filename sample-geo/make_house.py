"""Writes the invented gabled house (CityGML 2.0 and 3.0, LoD2) of sample-geo: 10 m x 8 m, eaves 6 m,
ridge 9 m along x, in ETRS89 / UTM zone 32N. Run: python3 make_house.py (writes gabled-house.gml and
../src/test/resources/org/solmass/geo/gabled-house-3.0.gml)."""
E0, N0 = 560100.0, 5330100.0
P = {"A": (0, 0, 0), "B": (10, 0, 0), "C": (10, 8, 0), "D": (0, 8, 0),
     "A'": (0, 0, 6), "B'": (10, 0, 6), "C'": (10, 8, 6), "D'": (0, 8, 6), "R1": (0, 4, 9), "R2": (10, 4, 9)}
FACES = [  # (kind, id, corners counter-clockwise seen from outside)
    ("GroundSurface", "ground", ["A", "D", "C", "B"]),
    ("WallSurface", "wall-south", ["A", "B", "B'", "A'"]),
    ("WallSurface", "wall-north", ["C", "D", "D'", "C'"]),
    ("WallSurface", "wall-east", ["B", "C", "C'", "R2", "B'"]),
    ("WallSurface", "wall-west", ["D", "A", "A'", "R1", "D'"]),
    ("RoofSurface", "roof-south", ["A'", "B'", "R2", "R1"]),
    ("RoofSurface", "roof-north", ["C'", "D'", "R1", "R2"]),
]

def pos_list(names):
    pts = [P[n] for n in names] + [P[names[0]]]
    return " ".join("%.3f %.3f %.3f" % (E0 + x, N0 + y, z) for x, y, z in pts)

def surfaces(v3):
    out = []
    for kind, fid, names in FACES:
        poly = ('<gml:Polygon gml:id="%s-poly"><gml:exterior><gml:LinearRing><gml:posList srsDimension="3">%s'
                '</gml:posList></gml:LinearRing></gml:exterior></gml:Polygon>') % (fid, pos_list(names))
        ms = "<gml:MultiSurface><gml:surfaceMember>%s</gml:surfaceMember></gml:MultiSurface>" % poly
        if v3:
            out.append('      <core:boundary><con:%s gml:id="%s"><core:lod2MultiSurface>%s</core:lod2MultiSurface></con:%s></core:boundary>'
                       % (kind, fid, ms, kind))
        else:
            out.append('      <bldg:boundedBy><bldg:%s gml:id="%s"><bldg:lod2MultiSurface>%s</bldg:lod2MultiSurface></bldg:%s></bldg:boundedBy>'
                       % (kind, fid, ms, kind))
    return "\n".join(out)

SRS = "urn:ogc:def:crs,crs:EPSG::25832,crs:EPSG::7837"
ENV = ('<gml:boundedBy><gml:Envelope srsName="%s" srsDimension="3"><gml:lowerCorner>%.1f %.1f 0</gml:lowerCorner>'
       '<gml:upperCorner>%.1f %.1f 9</gml:upperCorner></gml:Envelope></gml:boundedBy>') % (SRS, E0, N0, E0 + 10, N0 + 8)

V2 = """<?xml version="1.0" encoding="UTF-8"?>
<!-- Invented gabled house for Solmass tests and examples (not a real building). -->
<core:CityModel xmlns:core="http://www.opengis.net/citygml/2.0" xmlns:bldg="http://www.opengis.net/citygml/building/2.0"
    xmlns:gml="http://www.opengis.net/gml">
  %s
  <core:cityObjectMember>
    <bldg:Building gml:id="house-1">
      <gml:name>Gabled house</gml:name>
%s
    </bldg:Building>
  </core:cityObjectMember>
</core:CityModel>
""" % (ENV, surfaces(False))

V3 = """<?xml version="1.0" encoding="UTF-8"?>
<!-- Invented gabled house for Solmass tests (not a real building), CityGML 3.0 encoding. -->
<core:CityModel xmlns:core="http://www.opengis.net/citygml/3.0" xmlns:bldg="http://www.opengis.net/citygml/building/3.0"
    xmlns:con="http://www.opengis.net/citygml/construction/3.0" xmlns:gml="http://www.opengis.net/gml/3.2">
  %s
  <core:cityObjectMember>
    <bldg:Building gml:id="house-1">
%s
    </bldg:Building>
  </core:cityObjectMember>
</core:CityModel>
""" % (ENV, surfaces(True))

if __name__ == "__main__":
    import os
    here = os.path.dirname(os.path.abspath(__file__))
    open(os.path.join(here, "gabled-house.gml"), "w").write(V2)
    t = os.path.join(here, "..", "src", "test", "resources", "org", "solmass", "geo")
    os.makedirs(t, exist_ok=True)
    open(os.path.join(t, "gabled-house-3.0.gml"), "w").write(V3)

package org.solmass.viewer;

import javafx.scene.AmbientLight;
import javafx.scene.Group;
import javafx.scene.Node;
import javafx.scene.image.Image;
import javafx.scene.image.PixelFormat;
import javafx.scene.image.WritableImage;
import javafx.scene.paint.Color;
import javafx.scene.paint.PhongMaterial;
import javafx.scene.shape.Box;
import javafx.scene.shape.CullFace;
import javafx.scene.shape.MeshView;
import javafx.scene.shape.TriangleMesh;
import javafx.scene.shape.VertexFormat;
import javafx.geometry.Point3D;

import java.util.ArrayList;
import java.util.List;

/**
 * The 3D content: grey massing (lit), patch meshes coloured through the palette atlas (unlit, so
 * their colours match the legend exactly), a ground plane and the selection frame.
 * Patches live in a few large meshes; a picked face maps to its patch through {@link PatchMeshData}.
 */
public final class ModelView3D {
    static final Color CONTEXT_GREY = Color.rgb(0xE4, 0xE2, 0xDD);
    static final Color ANALYSED_GREY = Color.rgb(0xC4, 0xC2, 0xBD);
    static final Color GROUND = Color.rgb(0xBF, 0xBE, 0xB8);
    /** Analysed blocks in the set-up, before any result: a warm tint that reads apart from the context grey. */
    static final Color SETUP_ANALYSED = Color.rgb(0xD9, 0x9A, 0x5B);
    /** How context blocks are drawn: as solid as the rest, see-through, or not at all. */
    static final java.util.List<String> CONTEXT_MODES = java.util.List.of("shown", "ghosted", "hidden");
    /** Opacity of ghosted context blocks: enough to see their outline, little enough to see through them (common practice for ghosting, about a third). */
    static final double GHOST_ALPHA = 0.3;

    private final Group root = new Group();
    private final Group zoneGroup = new Group();
    private final Group selection = new Group();
    private final List<PatchMeshData> patchData;
    private final List<WritableImage> patchTextures = new ArrayList<>();
    private final List<MeshView> patchViews = new ArrayList<>();
    private final Group patchGroup = new Group();
    /** The shadow study's patches (analysed, context, ground), shown instead of the result patches while it is on. */
    private final Group shadowGroup = new Group();
    private final List<PatchMeshData> shadowData;
    private final List<WritableImage> shadowTextures = new ArrayList<>();
    private final List<MeshView> massingViews = new ArrayList<>();
    private final List<MassingMeshData> massingData = new ArrayList<>();
    private final List<MeshView> contextViews = new ArrayList<>();
    private PhongMaterial contextSolid, contextGhost;
    private final SceneFrame frame;
    private final double liftM;

    /** Geometry prepared off the FX thread. */
    /**
     * Geometry prepared off the FX thread.
     *
     * @param shadowLayer meshes of the shadow study's patches (analysed, context and ground, from
     *                    shadows/shadow-patches.csv, {@link ShadowFrames#perPatch}); empty without them
     */
    public record Prepared(SceneFrame frame, double liftM, double[] focus, double[] siteFocus, List<PatchMeshData> patches,
                           List<MassingMeshData> analysed, List<MassingMeshData> context, List<PatchMeshData> shadowLayer) {
        public static Prepared of(ViewerData d) {
            SceneFrame f = SceneFrame.of(d.model().bounds());
            double lift = Math.max(0.01, Math.min(0.15, f.radiusM() * 2e-4));
            List<PatchMeshData> layer = d.shadows().hasPatches()
                    ? PatchMeshData.build(d.shadows().perPatch().patches(), f, lift) : List.of();
            return new Prepared(f, lift, ModelView3D.focus(d, f), sphere(d.model().bounds(), f), PatchMeshData.build(d.patches(), f, lift),
                    MassingMeshData.build(d.model(), f, d.blockAnalysed(), true),
                    MassingMeshData.build(d.model(), f, d.blockAnalysed(), false), layer);
        }
    }

    /**
     * What the camera frames first: {x, y, z, radius} in the scene frame, the sphere around the
     * analysed patches (the whole model when there are none).
     */
    static double[] focus(ViewerData d, SceneFrame f) {
        double[] b = {Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY,
                Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY};
        for (org.solmass.surface.Patch p : d.patches()) {
            double[] o = p.outline();
            for (int i = 0; i < o.length; i += 3) {
                for (int k = 0; k < 3; k++) {
                    b[k] = Math.min(b[k], o[i + k]);
                    b[k + 3] = Math.max(b[k + 3], o[i + k]);
                }
            }
        }
        if (d.patches().isEmpty()) b = d.model().bounds();
        return sphere(b, f);
    }

    /**
     * The sphere around a box {minX, minY, minZ, maxX, maxY, maxZ} (model coordinates) as {x, y, z,
     * radius} in the scene frame: the whole model with its context, for the first view.
     */
    static double[] sphere(double[] b, SceneFrame f) {
        double dx = b[3] - b[0], dy = b[4] - b[1], dz = b[5] - b[2];
        double r = Math.max(1, 0.5 * Math.sqrt(dx * dx + dy * dy + dz * dz));
        return new double[] {f.fx((b[0] + b[3]) / 2), f.fy((b[2] + b[5]) / 2), f.fz((b[1] + b[4]) / 2), r};
    }

    public ModelView3D(ViewerData data, Prepared prep) {
        this.frame = prep.frame();
        this.liftM = prep.liftM();
        this.patchData = prep.patches();
        this.shadowData = prep.shadowLayer();

        Group massing = new Group();
        addMassing(massing, prep.analysed(), data.patches().isEmpty() ? SETUP_ANALYSED : ANALYSED_GREY);
        int first = massingViews.size();
        Group context = new Group();   // after the patches: a ghosted block lets the patches behind it show
        contextSolid = addMassing(context, prep.context(), CONTEXT_GREY);
        contextViews.addAll(massingViews.subList(first, massingViews.size()));
        // the 3D pipeline blends as colour + (1 - alpha) x behind, so the colour goes in premultiplied by its alpha
        contextGhost = new PhongMaterial(Color.color(CONTEXT_GREY.getRed() * GHOST_ALPHA, CONTEXT_GREY.getGreen() * GHOST_ALPHA,
                CONTEXT_GREY.getBlue() * GHOST_ALPHA, GHOST_ALPHA));
        contextGhost.setSpecularColor(Color.BLACK);
        Node ground = ground(data);
        massing.getChildren().add(ground);

        Group patches = patchGroup;
        for (PatchMeshData pd : patchData) patchViews.add(patchMesh(pd, patchTextures, patches));
        for (PatchMeshData pd : shadowData) patchMesh(pd, shadowTextures, shadowGroup);
        shadowGroup.setVisible(false);
        shadowGroup.setMouseTransparent(true);   // picks fall through to the massing under it

        AmbientLight flat = new AmbientLight(Color.WHITE);   // the only light: shades are baked into textures
        zoneGroup.setVisible(false);
        addZoneOutlines(data);
        addModuleOutlines(data);
        root.getChildren().addAll(massing, patches, shadowGroup, context, zoneGroup, selection, flat);
    }

    /** A patch mesh textured through its palette atlas (unlit), added to {@code g}; its texture goes into {@code textures}. */
    private static MeshView patchMesh(PatchMeshData pd, List<WritableImage> textures, Group g) {
        TriangleMesh m = new TriangleMesh(VertexFormat.POINT_NORMAL_TEXCOORD);
        m.getPoints().setAll(pd.points);
        m.getNormals().setAll(pd.normals);
        m.getTexCoords().setAll(pd.texCoords);
        m.getFaces().setAll(pd.faces);
        WritableImage tex = new WritableImage(pd.atlas.width, pd.atlas.height);
        PhongMaterial mat = new PhongMaterial(Color.WHITE);
        mat.setDiffuseMap(tex);
        mat.setSpecularColor(Color.BLACK);
        MeshView v = new MeshView(m);
        v.setMaterial(mat);
        v.setCullFace(CullFace.NONE);
        textures.add(tex);
        g.getChildren().add(v);
        return v;
    }

    /** Whether the shadow study has patches of its own to draw (shadows/shadow-patches.csv). */
    public boolean hasShadowLayer() { return !shadowData.isEmpty(); }

    /**
     * Shows the shadow study's patches (analysed, context and ground) with one sRGB 0xRRGGBB each, in
     * the order of {@link ShadowFrames#perPatch}, in place of the result patches; null hides them and
     * shows the result patches again.
     */
    public void showShadowLayer(int[] rgb) {
        boolean on = rgb != null && !shadowData.isEmpty();
        if (on) fill(shadowData, shadowTextures, rgb);
        shadowGroup.setVisible(on);
        patchGroup.setVisible(!on);
    }

    private static void fill(List<PatchMeshData> data, List<WritableImage> textures, int[] rgb) {
        for (int i = 0; i < data.size(); i++) {
            PatchMeshData pd = data.get(i);
            int[] px = new int[pd.atlas.width * pd.atlas.height];
            pd.texels(rgb, px);
            textures.get(i).getPixelWriter().setPixels(0, 0, pd.atlas.width, pd.atlas.height,
                    PixelFormat.getIntArgbInstance(), px, 0, pd.atlas.width);
        }
    }

    /** The shaded material of a massing colour. */
    private static PhongMaterial material(Color c) {
        WritableImage tex = new WritableImage(MassingMeshData.LEVELS, 1);
        int rgb = ((int) Math.round(c.getRed() * 255) << 16) | ((int) Math.round(c.getGreen() * 255) << 8) | (int) Math.round(c.getBlue() * 255);
        int[] px = MassingMeshData.shadeTexture(rgb);
        tex.getPixelWriter().setPixels(0, 0, MassingMeshData.LEVELS, 1, PixelFormat.getIntArgbInstance(), px, 0, MassingMeshData.LEVELS);
        PhongMaterial mat = new PhongMaterial(Color.WHITE);
        mat.setDiffuseMap(tex);
        mat.setSpecularColor(Color.BLACK);
        return mat;
    }

    /** Context blocks "shown", "ghosted" (see-through) or "hidden" ({@link #CONTEXT_MODES}). */
    public void setContextMode(String mode) {
        for (MeshView v : contextViews) {
            v.setVisible(!"hidden".equals(mode));
            v.setMaterial("ghosted".equals(mode) ? contextGhost : contextSolid);
        }
    }

    private PhongMaterial addMassing(Group g, List<MassingMeshData> parts, Color c) {
        PhongMaterial mat = material(c);
        for (MassingMeshData md : parts) {
            TriangleMesh m = new TriangleMesh(VertexFormat.POINT_NORMAL_TEXCOORD);
            m.getPoints().setAll(md.points);
            m.getNormals().setAll(md.normals);
            m.getTexCoords().setAll(MassingMeshData.TEX_COORDS);
            m.getFaces().setAll(md.faces);
            MeshView v = new MeshView(m);
            v.setMaterial(mat);
            v.setCullFace(CullFace.NONE);
            massingViews.add(v);
            massingData.add(md);
            g.getChildren().add(v);
        }
        return mat;
    }

    private Node ground(ViewerData d) {
        double[] b = d.model().bounds();
        double w = 30 * frame.radiusM(), h = w;
        Box g = new Box(w, 0.01, h);
        g.setTranslateY(frame.fy(b[2]) + 3 * liftM);
        PhongMaterial mat = new PhongMaterial(GROUND);
        mat.setSpecularColor(Color.BLACK);
        g.setMaterial(mat);
        g.setMouseTransparent(true);
        return g;
    }

    public Group node() { return root; }

    public SceneFrame frame() { return frame; }

    /** The PV roof zone outlines (empty when the results have no zones). */
    public Group zoneGroup() { return zoneGroup; }

    /** Whether the results carry PV roof zones or placed modules. */
    public boolean hasZones() { return !zoneGroup.getChildren().isEmpty(); }

    private void addZoneOutlines(ViewerData d) {
        PhongMaterial mat = new PhongMaterial(Color.rgb(0x0E, 0x6B, 0x5E));
        for (double[] e : ZoneOutlines.edges(d.patches(), d.table())) {
            org.solmass.surface.Patch p = d.patches().get((int) e[6]);
            double r = Math.max(0.04, Math.sqrt(p.areaM2()) * 0.06), lift = 3 * liftM;
            Point3D a = new Point3D(frame.fx(e[0] + p.normal().x() * lift), frame.fy(e[2] + p.normal().z() * lift),
                    frame.fz(e[1] + p.normal().y() * lift));
            Point3D b = new Point3D(frame.fx(e[3] + p.normal().x() * lift), frame.fy(e[5] + p.normal().z() * lift),
                    frame.fz(e[4] + p.normal().y() * lift));
            zoneGroup.getChildren().add(Shapes.rod(a, b, r, mat));
        }
    }

    /**
     * The placed PV modules' outlines (results' modules.geojson), thin dark rods lifted off the roof
     * along the module's upward normal (Newell's polygon normal), in the zone outlines' group so the
     * same box shows and hides them.
     */
    private void addModuleOutlines(ViewerData d) {
        PhongMaterial mat = new PhongMaterial(Color.rgb(0x1B, 0x24, 0x30));
        double r = Math.max(0.02, Math.min(0.05, frame.radiusM() * 1e-4)), lift = 4 * liftM;
        for (double[] ring : d.moduleRings()) {
            int n = ring.length / 3;
            double nx = 0, ny = 0, nz = 0;
            for (int i = 0; i < n; i++) {
                int j = (i + 1) % n;
                nx += (ring[3 * i + 1] - ring[3 * j + 1]) * (ring[3 * i + 2] + ring[3 * j + 2]);
                ny += (ring[3 * i + 2] - ring[3 * j + 2]) * (ring[3 * i] + ring[3 * j]);
                nz += (ring[3 * i] - ring[3 * j]) * (ring[3 * i + 1] + ring[3 * j + 1]);
            }
            double len = Math.sqrt(nx * nx + ny * ny + nz * nz), s = len > 0 ? (nz < 0 ? -lift : lift) / len : 0;
            for (int i = 0; i < n; i++) {
                int j = (i + 1) % n;
                Point3D a = new Point3D(frame.fx(ring[3 * i] + nx * s), frame.fy(ring[3 * i + 2] + nz * s), frame.fz(ring[3 * i + 1] + ny * s));
                Point3D b = new Point3D(frame.fx(ring[3 * j] + nx * s), frame.fy(ring[3 * j + 2] + nz * s), frame.fz(ring[3 * j + 1] + ny * s));
                zoneGroup.getChildren().add(Shapes.rod(a, b, r, mat));
            }
        }
    }

    /** Recolours the patches: palette entry per patch (0..257, see {@link ColourScale}) of {@code scale}. */
    public void recolour(ColourScale scale, int[] paletteOfPatch) {
        int[] lut = new int[ColourScale.BELOW_INDEX + 1];
        for (int i = 0; i < lut.length; i++) lut[i] = scale.rgbOfIndex(i);
        int[] rgb = new int[paletteOfPatch.length];
        for (int i = 0; i < rgb.length; i++) rgb[i] = lut[paletteOfPatch[i]];
        recolourRgb(rgb);
    }

    /** Recolours the patches with one sRGB 0xRRGGBB per patch (e.g. the shadow study). */
    public void recolourRgb(int[] rgb) {
        fill(patchData, patchTextures, rgb);
    }

    /** Patch index under a pick (node, face, texture coordinate), -1 if the node is not a patch mesh. */
    public int patchAt(Node n, int face, javafx.geometry.Point2D tex) {
        int i = patchViews.indexOf(n);
        if (i < 0) return -1;
        return tex == null ? patchData.get(i).patchOfFace(face) : patchData.get(i).patchAt(face, tex.getX(), tex.getY());
    }

    /** Block id of a picked face of the grey massing, -1 if the node is not massing. */
    public int blockAt(Node n, int face) {
        int i = massingViews.indexOf(n);
        if (i < 0) return -1;
        int[] f = massingData.get(i).faceToBlock;
        return face >= 0 && face < f.length ? f[face] : -1;
    }

    /** Frames the selected patch (or clears the frame when null). */
    public void select(org.solmass.surface.Patch p) {
        selection.getChildren().clear();
        if (p == null) return;
        double[] o = p.outline();
        int n = o.length / 3;
        double lift = 2 * liftM;
        double r = Math.max(0.03, Math.sqrt(p.areaM2()) * 0.04);
        PhongMaterial mat = new PhongMaterial(Color.rgb(20, 20, 24));
        for (int i = 0; i < n; i++) {
            int j = (i + 1) % n;
            Point3D a = point(o, i, p, lift), b = point(o, j, p, lift);
            selection.getChildren().add(Shapes.rod(a, b, r, mat));
        }
    }

    private Point3D point(double[] o, int i, org.solmass.surface.Patch p, double lift) {
        return new Point3D(frame.fx(o[3 * i] + p.normal().x() * lift), frame.fy(o[3 * i + 2] + p.normal().z() * lift),
                frame.fz(o[3 * i + 1] + p.normal().y() * lift));
    }
}

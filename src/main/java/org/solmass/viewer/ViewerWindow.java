package org.solmass.viewer;

import javafx.application.Platform;
import javafx.geometry.Insets;
import javafx.geometry.Point2D;
import javafx.geometry.Pos;
import javafx.scene.Node;
import javafx.scene.Scene;
import javafx.scene.SceneAntialiasing;
import javafx.scene.SubScene;
import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.control.ProgressBar;
import javafx.scene.control.ScrollPane;
import javafx.scene.control.Tab;
import javafx.scene.control.TabPane;
import javafx.scene.input.PickResult;
import javafx.scene.layout.BorderPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Pane;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;
import javafx.scene.layout.StackPane;
import javafx.scene.layout.VBox;
import javafx.scene.paint.Color;
import javafx.scene.paint.CycleMethod;
import javafx.scene.paint.LinearGradient;
import javafx.scene.paint.Paint;
import javafx.scene.paint.Stop;
import javafx.scene.shape.Circle;
import javafx.scene.shape.Polygon;
import javafx.scene.text.Text;
import javafx.stage.Stage;

import java.util.Locale;
import java.util.concurrent.CancellationException;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.function.Consumer;

/**
 * The main window: controls on the left, the 3D model (and the climate tab) in the middle, the
 * picked patch on the right, site and warnings at the bottom. All methods run on the FX thread
 * unless they say otherwise.
 */
public final class ViewerWindow {
    static final Paint BACKDROP = new LinearGradient(0, 0, 0, 1, true, CycleMethod.NO_CYCLE,
            new Stop(0, Color.rgb(0xF4, 0xF3, 0xF0)), new Stop(1, Color.rgb(0xDD, 0xDB, 0xD6)));

    private final Stage stage;
    private final ViewerActions actions;
    private final BorderPane root = new BorderPane();
    private final Pane subHost = new Pane();
    private final SunInset sunInset = new SunInset();
    private final javafx.scene.control.ChoiceBox<String> contextMode = new javafx.scene.control.ChoiceBox<>(
            javafx.collections.FXCollections.observableArrayList(ModelView3D.CONTEXT_MODES));
    private final TabPane leftTabs = new TabPane();
    private final Tab setupTab = new Tab("Set-up"), resultsTab = new Tab("Results");
    private SetupPanel setup;
    /** Whether the sun path inset was turned on once the set-up's site was complete. */
    private boolean insetOffered;
    /** The last results put on show (not a set-up preview). */
    private ViewerData lastResults;
    private final StackPane viewStack = new StackPane();
    private final PatchPanel panel = new PatchPanel();
    private final ClimatePane climate = new ClimatePane();
    private final ElevationPane elevations;
    private final StatisticsPane statistics;
    private final ControlColumn controls;
    private final Label hover = new Label();
    private final Label status = new Label();
    private final javafx.scene.Group north = new javafx.scene.Group();
    private final VBox busy = new VBox(8);
    private final ProgressBar bar = new ProgressBar(-1);
    private final Label busyText = new Label();
    private final AtomicBoolean cancelled = new AtomicBoolean();
    private final TabPane tabs;
    private SubScene sub;
    private CameraRig rig;
    private ModelView3D view;
    private ViewerData data;
    private long shownAtNanos;

    public ViewerWindow(Stage stage, ViewerActions actions, double width, double height) {
        this.stage = stage;
        this.actions = actions;
        this.controls = new ControlColumn(this, actions);
        this.elevations = new ElevationPane(controls::quantity, controls::scale);
        this.statistics = new StatisticsPane(controls::quantity);
        hover.getStyleClass().add("hover");
        hover.setVisible(false);
        hover.setMouseTransparent(true);
        buildNorthArrow();
        Button cancel = new Button("Cancel");
        cancel.setOnAction(e -> {
            cancelled.set(true);
            busyText.setText("Cancelling\u2026");
        });
        bar.setPrefWidth(320);
        busy.getChildren().addAll(busyText, bar, cancel);
        busy.setAlignment(Pos.CENTER);
        busy.getStyleClass().add("busy");
        busy.setMaxSize(380, 130);
        busy.setVisible(false);
        subHost.setMinSize(0, 0);
        subHost.getChildren().add(warmUp());
        sunInset.setVisible(false);
        sunInset.managedProperty().bind(sunInset.visibleProperty());
        contextMode.setId("context-mode");
        contextMode.getSelectionModel().select(0);
        contextMode.valueProperty().addListener((o, a, b) -> { if (view != null) view.setContextMode(b); });
        HBox contextBox = new HBox(6, new Label("Context blocks"), contextMode);
        contextBox.setAlignment(Pos.CENTER_LEFT);
        contextBox.getStyleClass().add("overlay-box");
        contextBox.setMaxSize(Region.USE_PREF_SIZE, Region.USE_PREF_SIZE);
        viewStack.getChildren().addAll(subHost, north, contextBox, sunInset, hover, busy);
        StackPane.setAlignment(north, Pos.TOP_RIGHT);
        StackPane.setMargin(north, new Insets(14));
        StackPane.setAlignment(contextBox, Pos.TOP_LEFT);
        StackPane.setMargin(contextBox, new Insets(10));
        StackPane.setAlignment(sunInset, Pos.BOTTOM_RIGHT);
        StackPane.setMargin(sunInset, new Insets(10));
        StackPane.setAlignment(hover, Pos.TOP_LEFT);
        viewStack.setMinSize(0, 0);
        Tab elevationTab = new Tab("Facade elevations", elevations), statisticsTab = new Tab("Statistics", statistics);
        tabs = new TabPane(new Tab("Model", viewStack), new Tab("Climate at a glance", new ScrollPane(climate)), elevationTab,
                statisticsTab);
        tabs.setTabClosingPolicy(TabPane.TabClosingPolicy.UNAVAILABLE);
        tabs.getSelectionModel().selectedItemProperty().addListener((o, a, b) -> {
            elevations.setActive(b == elevationTab);
            statistics.setActive(b == statisticsTab);
        });
        controls.colouringProperty().addListener((o, a, b) -> {
            elevations.redraw();
            statistics.redraw();
        });
        ScrollPane right = new ScrollPane(panel);
        right.setFitToWidth(true);
        right.setPrefWidth(350);
        right.setHbarPolicy(ScrollPane.ScrollBarPolicy.NEVER);
        ScrollPane left = new ScrollPane(controls);
        left.setFitToWidth(true);
        left.setPrefWidth(270);
        left.setHbarPolicy(ScrollPane.ScrollBarPolicy.NEVER);
        resultsTab.setContent(left);
        leftTabs.setTabClosingPolicy(TabPane.TabClosingPolicy.UNAVAILABLE);
        leftTabs.setPrefWidth(330);
        leftTabs.setId("left-tabs");
        status.getStyleClass().add("status");
        status.setMaxWidth(Double.MAX_VALUE);
        root.setLeft(left);
        root.setTop(menu());
        root.setCenter(tabs);
        root.setRight(right);
        root.setBottom(status);
        Scene scene = new Scene(root, width, height);
        scene.getStylesheets().add(ViewerWindow.class.getResource("viewer.css").toExternalForm());
        stage.setScene(scene);
        stage.setTitle("Solmass viewer");
    }

    private javafx.scene.control.MenuBar menu() {
        javafx.scene.control.MenuItem fresh = new javafx.scene.control.MenuItem("New study from a model\u2026");
        fresh.setId("new-study");
        fresh.setOnAction(e -> {
            javafx.stage.FileChooser fc = new javafx.stage.FileChooser();
            fc.setTitle("Model for a new study");
            fc.getExtensionFilters().add(new javafx.stage.FileChooser.ExtensionFilter("OBJ model (*.obj)", "*.obj", "*.OBJ"));
            java.io.File f = fc.showOpenDialog(stage);
            if (f != null) startSetup(f.toPath().toAbsolutePath().normalize());
        });
        javafx.scene.control.MenuItem close = new javafx.scene.control.MenuItem("Close window");
        close.setOnAction(e -> stage.hide());
        return new javafx.scene.control.MenuBar(new javafx.scene.control.Menu("File", null, fresh, close));
    }

    /**
     * A tiny 3D sub-scene with the materials the model uses, shown while the data loads, so the
     * pipeline compiles its 3D shaders before the model's first frame rather than during it.
     */
    private static Node warmUp() {
        javafx.scene.image.WritableImage tex = new javafx.scene.image.WritableImage(2, 2);
        javafx.scene.paint.PhongMaterial m = new javafx.scene.paint.PhongMaterial(Color.WHITE);
        m.setDiffuseMap(tex);
        m.setSpecularColor(Color.BLACK);
        javafx.scene.shape.Box b = new javafx.scene.shape.Box(1, 1, 1);
        b.setMaterial(m);
        javafx.scene.shape.Box c = new javafx.scene.shape.Box(1, 1, 1);
        c.setMaterial(new javafx.scene.paint.PhongMaterial(Color.GRAY));
        javafx.scene.PerspectiveCamera cam = new javafx.scene.PerspectiveCamera(true);
        cam.setTranslateZ(-4);
        SubScene s = new SubScene(new javafx.scene.Group(b, c, new javafx.scene.AmbientLight(Color.WHITE)), 4, 4, true,
                SceneAntialiasing.BALANCED);
        s.setCamera(cam);
        s.setOpacity(0.01);
        s.setMouseTransparent(true);
        return s;
    }

    private void buildNorthArrow() {
        Circle ring = new Circle(28, Color.rgb(255, 255, 255, 0.85));
        ring.setStroke(Color.rgb(70, 70, 70));
        Polygon arrow = new Polygon(0, -8, 8, 20, 0, 14, -8, 20);
        arrow.setFill(Color.rgb(40, 40, 40));
        Text n = new Text("N");
        n.setStyle("-fx-font-weight: bold; -fx-font-size: 13px;");
        n.setFill(Color.rgb(40, 40, 40));
        n.setX(-n.getLayoutBounds().getWidth() / 2);
        n.setY(-12);
        north.getChildren().addAll(ring, arrow, n);
        north.setMouseTransparent(true);
    }

    public Stage stage() { return stage; }

    public ViewerData data() { return data; }

    PatchPanel panel() { return panel; }

    ModelView3D view() { return view; }

    SubScene subScene() { return sub; }

    CameraRig rig() { return rig; }

    /** Runs a loader in the background with the progress overlay; hands the data to {@link #show}. */
    public void load(ViewerLoader loader, Consumer<ViewerWindow> whenShown) {
        load(loader, whenShown, null);
    }

    /**
     * As {@link #load(ViewerLoader, Consumer)}; {@code whenFailed} (FX thread, may be null) hears of a
     * failed or cancelled load (a {@link CancellationException} when cancelled).
     */
    public void load(ViewerLoader loader, Consumer<ViewerWindow> whenShown, Consumer<Throwable> whenFailed) {
        runBusy("Preparing\u2026", () -> loader.load(this::progress, cancelled::get), whenShown, whenFailed);
    }

    interface Job { ViewerData run() throws Exception; }

    void runBusy(String what, Job job, Consumer<ViewerWindow> whenShown, Consumer<Throwable> whenFailed) {
        cancelled.set(false);
        busyText.setText(what);
        bar.setProgress(-1);
        busy.setVisible(true);
        Thread t = new Thread(() -> {
            try {
                ViewerData d = job.run();
                if (Boolean.getBoolean("solmass.viewer.timing")) System.err.printf("viewer: data loaded at %.2f%n", System.nanoTime() / 1e9 % 1000);
                if (d == null || cancelled.get()) throw new CancellationException();
                progress(-1, "Building the 3D view\u2026");
                long t1 = System.nanoTime();
                ModelView3D.Prepared prep = ModelView3D.Prepared.of(d);
                if (Boolean.getBoolean("solmass.viewer.timing")) System.err.printf("viewer: meshes prepared in %.2f s%n", (System.nanoTime() - t1) / 1e9);
                Platform.runLater(() -> {
                    show(d, prep);
                    busy.setVisible(false);
                    if (whenShown != null) whenShown.accept(this);
                });
            } catch (CancellationException e) {
                Platform.runLater(() -> {
                    busy.setVisible(false);
                    status.setText(data == null ? "Cancelled: nothing to show." : "Cancelled: showing the previous results.");
                    if (whenFailed != null) whenFailed.accept(e);
                });
            } catch (Exception | OutOfMemoryError e) {
                Platform.runLater(() -> {
                    busy.setVisible(false);
                    status.setText("Failed: " + e.getMessage());
                    if (whenFailed != null) whenFailed.accept(e);
                });
            }
        }, "solmass-viewer-job");
        t.setDaemon(true);
        t.start();
    }

    private void progress(double f, String msg) {
        Platform.runLater(() -> {
            bar.setProgress(f < 0 ? -1 : f);
            if (msg != null) busyText.setText(msg);
        });
    }

    /** Puts data on show (FX thread). */
    public void show(ViewerData d, ModelView3D.Prepared prep) {
        this.data = d;
        root.getRight().setVisible(!d.patches().isEmpty());   // a set-up preview has no patch to show
        root.getRight().setManaged(!d.patches().isEmpty());
        if (!d.patches().isEmpty()) lastResults = d;
        stage.setTitle("Solmass \u2014 " + d.title());
        long t0 = System.nanoTime();
        view = new ModelView3D(d, prep);
        long t1 = System.nanoTime();
        rig = new CameraRig(prep.frame().radiusM(), prep.focus(), prep.siteFocus());
        javafx.scene.Group world = new javafx.scene.Group(view.node(), rig.node());
        sunInset.setArcs(d.sunPath());
        boolean msaa = Platform.isSupported(javafx.application.ConditionalFeature.SCENE3D)
                && !"false".equals(System.getProperty("solmass.viewer.msaa"));
        sub = new SubScene(world, 10, 10, true, msaa ? SceneAntialiasing.BALANCED : SceneAntialiasing.DISABLED);
        sub.setFill(BACKDROP);
        sub.setCamera(rig.camera());
        sub.widthProperty().bind(subHost.widthProperty());
        sub.heightProperty().bind(subHost.heightProperty());
        subHost.getChildren().setAll(sub);
        rig.attach(sub);
        rig.headingProperty().addListener((o, a, b) -> north.setRotate(-b.doubleValue()));
        north.setRotate(-rig.headingDeg());
        sub.addEventHandler(javafx.scene.input.MouseEvent.MOUSE_CLICKED, e -> {
            if (e.isStillSincePress() && e.getButton() == javafx.scene.input.MouseButton.PRIMARY) pick(e.getPickResult());
        });
        sub.setOnMouseMoved(e -> hoverAt(e.getPickResult(), e.getX(), e.getY()));
        sub.setOnMouseExited(e -> hover.setVisible(false));
        long t2 = System.nanoTime();
        panel.setData(d);
        climate.show(d);
        long t3 = System.nanoTime();
        controls.setData(d);
        elevations.setData(d);
        statistics.setData(d);
        long t4 = System.nanoTime();
        if (Boolean.getBoolean("solmass.viewer.timing")) {
            System.err.printf("viewer: meshes %.2f s, scene %.2f s, panels %.2f s, colours %.2f s%n",
                    (t1 - t0) / 1e9, (t2 - t1) / 1e9, (t3 - t2) / 1e9, (t4 - t3) / 1e9);
        }
        setSunPathVisible(controls.sunPathOn());
        controls.setZonesAvailable(view.hasZones());
        view.zoneGroup().setVisible(view.hasZones() && controls.zonesOn());
        view.setContextMode(contextMode.getValue());
        if (!d.patches().isEmpty()) {
            resultsTab.setDisable(false);
            if (setup != null) leftTabs.getSelectionModel().select(resultsTab);
        }
        status.setText(statusLine(d));
        String q = System.getProperty("solmass.viewer.quantity");
        if (q != null) controls.select(q);
        String thr = System.getProperty("solmass.viewer.threshold");
        if (thr != null) controls.setThreshold(Double.parseDouble(thr));
        String ctx = System.getProperty("solmass.viewer.context");
        if (ctx != null && ModelView3D.CONTEXT_MODES.contains(ctx)) contextMode.setValue(ctx);
        String v = System.getProperty("solmass.viewer.view");
        if (v != null) rig.preset(v);
        if (v != null && v.startsWith("sun")) controls.setSunPath(true);
        if ("climate".equals(v)) tabs.getSelectionModel().select(1);
        if ("elevations".equals(v)) tabs.getSelectionModel().select(2);
        if ("statistics".equals(v)) tabs.getSelectionModel().select(3);
        if (v != null && v.startsWith("patch")) selectPatch(Math.min(d.patches().size() - 1, d.patches().size() / 3));
        shownAtNanos = System.nanoTime();
        if (Boolean.getBoolean("solmass.viewer.timing")) System.err.printf("viewer: data on show at %.2f%n", shownAtNanos / 1e9 % 1000);
    }

    private String statusLine(ViewerData d) {
        StringBuilder s = new StringBuilder(String.format(Locale.ROOT, "Site %.4f\u00b0 %s, %.4f\u00b0 %s \u00b7 %s \u00b7 %,d patches on %d blocks",
                Math.abs(d.latitudeDeg()), d.latitudeDeg() >= 0 ? "N" : "S", Math.abs(d.longitudeDeg()),
                d.longitudeDeg() >= 0 ? "E" : "W", d.zone(), d.patches().size(), d.model().blockNames().size()));
        for (String w : d.warnings()) s.append("  \u26a0 ").append(GuiWords.of(w));
        return s.toString();
    }

    /** Recolours the patches (called by the controls). */
    void applyColours(ColourScale scale, int[] cells) {
        if (view != null) view.recolour(scale, cells);
    }

    /** Colours the patches with one sRGB per patch (the shadow study). */
    void applyRgb(int[] rgb) {
        if (view != null) view.recolourRgb(rgb);
    }

    /** Shows the shadow study's own patches with one sRGB each ({@link ModelView3D#showShadowLayer}); null hides them. */
    void applyShadowLayer(int[] rgb) {
        if (view != null) view.showShadowLayer(rgb);
    }

    void setZonesVisible(boolean on) {
        if (view != null) view.zoneGroup().setVisible(on);
    }

    /** Shows or hides the sun path inset (a chart beside the model, docs/viewer.md "Sun path"). */
    void setSunPathVisible(boolean on) {
        sunInset.setVisible(on);
    }

    void preset(String v) {
        if (rig != null) rig.preset(v);
    }

    /** Handles a pick: a patch opens in the side panel; anything else clears it. */
    void pick(PickResult r) {
        if (setup != null && leftTabs.getSelectionModel().getSelectedItem() == setupTab && r != null && r.getIntersectedNode() != null) {
            int b = view.blockAt(r.getIntersectedNode(), r.getIntersectedFace());
            if (b < 0) b = blockOfPatch(patchOf(r));
            if (b >= 0) {
                setup.toggleBlock(b);
                return;
            }
        }
        int p = patchOf(r);
        panel.show(p);
        view.select(p >= 0 ? data.patches().get(p) : null);
        if (p < 0 && r != null && r.getIntersectedNode() != null) {
            int b = view.blockAt(r.getIntersectedNode(), r.getIntersectedFace());
            if (b >= 0) status.setText("Block " + data.model().blockNames().get(b)
                    + (data.blockAnalysed()[b] ? " (analysed)" : " (context, not analysed)"));
        }
    }

    /** Selects a patch by index as a click would. */
    public void selectPatch(int p) {
        panel.show(p);
        view.select(p >= 0 ? data.patches().get(p) : null);
    }

    private int patchOf(PickResult r) {
        if (r == null || r.getIntersectedNode() == null || view == null) return -1;
        return view.patchAt(r.getIntersectedNode(), r.getIntersectedFace(), r.getIntersectedTexCoord());
    }

    private void hoverAt(PickResult r, double x, double y) {
        int p = patchOf(r);
        if (p < 0) {
            hover.setVisible(false);
            return;
        }
        Quantity q = controls.quantity();
        if (q == null) {
            hover.setVisible(false);
            return;
        }
        double v = data.table().column(q.column())[p];
        hover.setText(q.format(v) + "  \u00b7  " + data.patches().get(p).id());
        hover.setTranslateX(x + 14);
        hover.setTranslateY(y + 10);
        hover.setVisible(true);
    }

    /** The 3D view rendered at {@code scale} times its on-screen size. */
    public javafx.scene.image.WritableImage snapshot3D(double scale) {
        javafx.scene.SnapshotParameters sp = new javafx.scene.SnapshotParameters();
        sp.setDepthBuffer(true);
        sp.setFill(BACKDROP);
        sp.setTransform(javafx.scene.transform.Transform.scale(scale, scale));
        return sub.snapshot(sp, null);
    }

    /** What the PNG export writes: the 3D view at {@code scale} with title, legend, north arrow and caution. */
    java.awt.image.BufferedImage exportSheet(double scale) { return controls.exportImage(scale); }

    /** The whole window as on screen. */
    public javafx.scene.image.WritableImage snapshotWindow() {
        return stage.getScene().snapshot(null);
    }

    /** Nanotime when the last data set was put on show. */
    long shownAtNanos() { return shownAtNanos; }

    void setStatus(String s) { status.setText(s); }

    /** The status line's text. */
    String statusText() { return status.getText(); }

    /** Colours the model by a column, as the selector would. */
    public void controlsSelect(String column) { controls.select(column); }

    /** Picks out the patches at or above a value in the current quantity's unit (NaN: off). */
    public void setThreshold(double value) { controls.setThreshold(value); }

    void rerun(RerunRequest req) {
        runBusy("Re-running the analysis\u2026", () -> actions.rerun(req, this::progress, cancelled::get), w -> {
            java.nio.file.Path variant = actions.shownFolder();
            if (variant != null) status.setText("Variant written to " + variant + " \u00b7 " + status.getText());
        }, null);
    }

    /** Opens one of the study's results folders (a variant) in place of the data on show. */
    void openVariant(java.nio.file.Path folder) {
        runBusy("Opening " + folder.getFileName() + "\u2026", () -> actions.openVariant(folder), w -> {
            status.setText("Showing " + folder + " \u00b7 " + status.getText());
        }, null);
    }

    Node root() { return root; }

    /**
     * Starts the new-study set-up on a model: the set-up tab on the left, the model in the 3D view
     * with its blocks as set up (analysed ones tinted), the results tab waiting for the first run.
     */
    public void startSetup(java.nio.file.Path obj) {
        ModelCheck mc;
        try {
            mc = ModelCheck.open(obj);
        } catch (RuntimeException e) {
            status.setText("Cannot open " + obj + ": " + GuiWords.of(e.getMessage()));
            return;
        }
        StudyDraft d = new StudyDraft(obj, mc.model().blockNames());
        d.unit = mc.unit();
        setup = new SetupPanel(d, mc, new SetupHost());
        ScrollPane sp = new ScrollPane(setup);
        sp.setFitToWidth(true);
        sp.setHbarPolicy(ScrollPane.ScrollBarPolicy.NEVER);
        setupTab.setContent(sp);
        leftTabs.getTabs().setAll(setupTab, resultsTab);
        leftTabs.getSelectionModel().selectedItemProperty().addListener((o, a, b) -> {
            // back on the results after the set-up's preview replaced them: show them again
            if (b == resultsTab && lastResults != null && data != lastResults) show(lastResults, ModelView3D.Prepared.of(lastResults));
        });
        resultsTab.setDisable(data == null || data.patches().isEmpty());
        leftTabs.getSelectionModel().select(setupTab);
        root.setLeft(leftTabs);
        preview(d, mc);
        status.setText("New study from " + obj.getFileName() + ": set it up on the left; click blocks in the view to make them context.");
    }

    /** The set-up panel, or null when the window was not started on a model. */
    SetupPanel setup() { return setup; }

    /** Shows the model as set up (no results): analysed blocks tinted, context as chosen; keeps the camera when the model is the same. */
    private void preview(StudyDraft d, ModelCheck mc) {
        java.util.List<SunArc> arcs = java.util.List.of();
        org.solmass.sun.Site site = null;
        try {
            java.time.ZoneId z = StudyDraft.zoneId(d.zone);
            double lat = StudyDraft.parse(d.latitude), lon = StudyDraft.parse(d.longitude);
            if (z != null && Math.abs(lat) <= 90 && Math.abs(lon) <= 180) {
                site = new org.solmass.sun.Site(lat, lon, 0, z);
                arcs = SunArc.of(site);
            }
        } catch (RuntimeException e) {
            arcs = java.util.List.of();
        }
        ViewerData pd = new ViewerData(d.name + " (set-up)", mc.model(), d.analysed.clone(), java.util.List.of(),
                new org.solmass.table.ResultTable(java.util.List.of()), null, null, arcs,
                site == null ? Double.NaN : site.latitudeDeg(), site == null ? Double.NaN : site.longitudeDeg(),
                site == null ? "" : site.zone().getId(), java.util.List.of());
        ModelView3D.Prepared prep = ModelView3D.Prepared.of(pd);
        if (view != null && data != null && data.model() == pd.model() && sub != null) {
            data = pd;
            ModelView3D v = new ModelView3D(pd, prep);
            ((javafx.scene.Group) sub.getRoot()).getChildren().set(0, v.node());
            view = v;
            view.setContextMode(contextMode.getValue());
            sunInset.setArcs(arcs);
            panel.setData(pd);
        } else {
            show(pd, prep);
        }
        if (!arcs.isEmpty() && !insetOffered) {   // the site is complete: its sun path helps the set-up
            insetOffered = true;
            controls.setSunPath(true);
        }
    }

    /** The block of a patch, -1 for none. */
    private int blockOfPatch(int p) {
        return p < 0 ? -1 : data.patches().get(p).block();
    }

    /** Runs a study from the set-up (a new results folder, or a variant folder beside the first). */
    void runStudy(org.solmass.study.Study s, String variantName) {
        if (setup != null) setup.setDisable(true);   // one run at a time; the set-up opens again when it ends
        runBusy("Running the analysis\u2026", () -> actions.runStudy(s, variantName, this::progress, cancelled::get), w -> {
            java.nio.file.Path f = actions.shownFolder();
            String line = "Results written to " + f;
            status.setText(line + " \u00b7 " + status.getText());
            if (setup != null) {
                setup.setDisable(false);
                setup.setDone(line + ". Change a setting and run again for a variant; earlier results stay as they are.");
            }
        }, e -> {
            if (setup != null) setup.setDisable(false);
            if (setup != null) setup.setDone(e instanceof CancellationException ? "Cancelled." : "The run failed: " + GuiWords.of(e.getMessage()));
        });
    }

    /** Shows the data on show with the differences from another results folder of the study (diverging colours). */
    void compare(java.nio.file.Path against) {
        runBusy("Comparing with " + against.getFileName() + "\u2026", () -> actions.compare(against), w -> {
            String none = matchedNone(data) ? "No patch of the two runs lines up with one of the other (different patch sizes"
                    + " make different grids), so nothing is coloured; compare runs of one patch size \u00b7 " : "";
            status.setText(none + "Differences from " + against + " \u00b7 " + status.getText());
            controls.selectFirstDelta();
        }, null);
    }

    /** Whether a comparison left every difference empty (no patch matched). */
    static boolean matchedNone(ViewerData d) {
        if (!d.table().has("delta_annual_kwh_m2")) return false;
        for (double v : d.table().column("delta_annual_kwh_m2")) if (!Double.isNaN(v)) return false;
        return true;
    }

    /** The window's side of the set-up. */
    private final class SetupHost implements SetupPanel.SetupHost {
        @Override public void draftChanged(StudyDraft d, ModelCheck mc) {
            if (data == null || data.patches().isEmpty() || data.model() != mc.model()) preview(d, mc);
            else if (leftTabs.getSelectionModel().getSelectedItem() == setupTab) preview(d, mc);
        }

        @Override public void runStudy(org.solmass.study.Study s, String variantName) {
            ViewerWindow.this.runStudy(s, variantName);
        }

        @Override public String saveStudy(org.solmass.study.Study s, java.nio.file.Path file, String text) throws Exception {
            if (java.nio.file.Files.exists(file) && !java.nio.file.Files.readString(file).equals(text)) {
                javafx.scene.control.Alert a = new javafx.scene.control.Alert(javafx.scene.control.Alert.AlertType.CONFIRMATION,
                        file + " exists. Replace it with this study?", javafx.scene.control.ButtonType.YES, javafx.scene.control.ButtonType.NO);
                a.initOwner(stage);
                if (a.showAndWait().orElse(javafx.scene.control.ButtonType.NO) != javafx.scene.control.ButtonType.YES) return "Not saved.";
            }
            java.nio.file.Path parent = file.toAbsolutePath().getParent();
            if (parent != null) java.nio.file.Files.createDirectories(parent);
            org.solmass.output.AtomicFiles.writeString(file, text);
            return "Saved " + file;
        }

        @Override public javafx.stage.Window window() { return stage; }
    }

    static HBox row(Node... n) {
        HBox h = new HBox(6, n);
        h.setAlignment(Pos.CENTER_LEFT);
        for (Node x : n) if (x instanceof javafx.scene.control.Control) HBox.setHgrow(x, Priority.SOMETIMES);
        return h;
    }
}

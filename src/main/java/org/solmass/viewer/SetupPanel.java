package org.solmass.viewer;

import javafx.collections.FXCollections;
import javafx.collections.transformation.FilteredList;
import javafx.geometry.Insets;
import javafx.scene.Node;
import javafx.scene.control.Button;
import javafx.scene.control.CheckBox;
import javafx.scene.control.ComboBox;
import javafx.scene.control.Label;
import javafx.scene.control.ListView;
import javafx.scene.control.RadioButton;
import javafx.scene.control.TextField;
import javafx.scene.control.TitledPane;
import javafx.scene.control.ToggleGroup;
import javafx.scene.layout.VBox;
import javafx.stage.FileChooser;
import org.solmass.model.LengthUnit;
import org.solmass.model.UpAxis;
import org.solmass.sky.SkyModels;
import org.solmass.study.Study;
import org.solmass.viewer.StudyDraft.Field;

import java.io.File;
import java.time.ZoneId;
import java.util.EnumMap;
import java.util.Locale;
import java.util.Map;

/**
 * The new-study set-up: six numbered sections down the left of the window (model, blocks, site,
 * climate, analysis, save and run), each field with its own error line beneath it. It edits a
 * {@link StudyDraft}; {@link SetupHost} (the window) shows the model as set up, saves and runs.
 */
final class SetupPanel extends VBox {
    /** What the panel needs from the window. */
    interface SetupHost {
        /** The draft changed in a way the 3D view shows (blocks, unit, up axis, site). */
        void draftChanged(StudyDraft d, ModelCheck model);

        /** Runs the study into a new results folder (the first run) or variant folder (later ones). */
        void runStudy(Study s, String variantName);

        /** Writes the study file; returns a line for the status, or throws with the reason. */
        String saveStudy(Study s, java.nio.file.Path file, String text) throws Exception;

        javafx.stage.Window window();
    }

    private final SetupHost host;
    final StudyDraft draft;
    private ModelCheck model;
    private final Map<Field, Label> errors = new EnumMap<>(Field.class);
    private final Map<Field, TitledPane> sectionOf = new EnumMap<>(Field.class);
    private final ComboBox<String> up = new ComboBox<>(FXCollections.observableArrayList("z (vertical is z)", "y (vertical is y)"));
    private final ComboBox<LengthUnit> unit = new ComboBox<>(FXCollections.observableArrayList(LengthUnit.values()));
    private final Label size = new Label();
    private final VBox suggestions = new VBox(6);
    private final VBox blockList = new VBox(3);
    private final TextField lat = field("latitude"), lon = field("longitude"), elev = field("elevation"), zoneSearch = field("zone");
    private final ListView<String> zones = new ListView<>();
    private final Label zoneNote = new Label();
    private final RadioButton clear = new RadioButton("Clear sky (no clouds)"), file = new RadioButton("Climate file");
    private final Label clearNote = new Label(ClimatePreview.CLEAR_SKY_NOTE);
    private final TextField climateFile = field("climate-file");
    private final VBox preview = new VBox(1);
    private final ComboBox<String> sky = new ComboBox<>(FXCollections.observableArrayList(SkyModels.names()));
    private final TextField patch = field("patch"), rays = field("rays");
    private final CheckBox map = new CheckBox("Map of the roofs (PNG)"), gltf = new CheckBox("3D model with colours (glTF)"),
            monthHour = new CheckBox("Month-hour table per patch (CSV)");
    private final Label estimate = new Label(), advice = new Label();
    private final TextField name = field("study-name"), studyFile = field("study-file"), results = field("results-folder"), variant = field("run-name");
    private final Label done = new Label();

    SetupPanel(StudyDraft draft, ModelCheck model, SetupHost host) {
        super(6);
        this.draft = draft;
        this.model = model;
        this.host = host;
        setId("setup");
        setPadding(new Insets(10));
        getStyleClass().add("controls");
        Label title = new Label("New study");
        title.getStyleClass().add("panel-heading");
        Label intro = small("Set up the study section by section. Nothing is written until you save or run.");
        getChildren().addAll(title, intro, modelSection(), blocksSection(), siteSection(), climateSection(), analysisSection(), runSection());
        fillFromDraft();
        refreshModel();
    }

    private TitledPane section(String title, Field[] fields, Node... content) {
        VBox box = new VBox(4, content);
        TitledPane t = new TitledPane(title, box);
        t.setAnimated(false);
        for (Field f : fields) sectionOf.put(f, t);
        return t;
    }

    private Label error(Field f) {
        Label l = new Label();
        l.getStyleClass().add("field-error");
        l.setId("error-" + f.name().toLowerCase(Locale.ROOT));
        l.setWrapText(true);
        l.setManaged(false);
        l.setVisible(false);
        errors.put(f, l);
        return l;
    }

    private Node modelSection() {
        up.setId("up-axis");
        unit.setId("unit");
        unit.setConverter(new javafx.util.StringConverter<>() {
            @Override public String toString(LengthUnit u) { return u == null ? "" : ModelCheck.unitName(u); }
            @Override public LengthUnit fromString(String s) { return null; }
        });
        up.setOnAction(e -> reread(up.getSelectionModel().getSelectedIndex() == 1 ? UpAxis.Y : UpAxis.Z, draft.unit));
        unit.setOnAction(e -> { if (unit.getValue() != null) reread(draft.up, unit.getValue()); });
        suggestions.setId("model-suggestions");
        return section("1 \u00b7 Model", new Field[] {Field.MODEL},
                small(draft.modelFile.getFileName().toString()), label("Vertical axis of the file"), up,
                label("Unit of the coordinates"), unit, size, suggestions, error(Field.MODEL));
    }

    private Node blocksSection() {
        Label hint = small("Ticked blocks are analysed (coloured in the view); the others are context: they cast shade and"
                + " reflect light but get no results. Click a block in the 3D view to switch it.");
        blockList.setId("blocks");
        javafx.scene.control.ScrollPane sp = new javafx.scene.control.ScrollPane(blockList);
        sp.setFitToWidth(true);
        sp.setPrefViewportHeight(130);
        Button all = new Button("All analysed"), none = new Button("All context");
        all.setOnAction(e -> setAll(true));
        none.setOnAction(e -> setAll(false));
        return section("2 \u00b7 Blocks", new Field[] {Field.BLOCKS}, hint, sp, ViewerWindow.row(all, none), error(Field.BLOCKS));
    }

    private Node siteSection() {
        lat.setPromptText("e.g. 51.5");
        lon.setPromptText("e.g. -0.12");
        elev.setPromptText("0");
        zoneSearch.setPromptText("search, e.g. Berlin, or +01:00");
        FilteredList<String> ids = new FilteredList<>(FXCollections.observableArrayList(new java.util.TreeSet<>(ZoneId.getAvailableZoneIds())));
        zones.setItems(ids);
        zones.setId("zone-list");
        zones.setPrefHeight(110);
        zoneSearch.textProperty().addListener((o, a, b) -> {
            String q = b.trim().toLowerCase(Locale.ROOT).replace(' ', '_');
            ids.setPredicate(z -> q.isEmpty() || z.toLowerCase(Locale.ROOT).contains(q));
            // a search that leaves one zone means that zone; otherwise the text itself (an id or an offset)
            draft.zone = StudyDraft.zoneId(b) == null && ids.size() == 1 ? ids.get(0) : b;
            ZoneId z = StudyDraft.zoneId(draft.zone);
            zoneNote.setText(z == null ? "" : "Time zone " + z.getId() + ", standard time UTC"
                    + z.getRules().getStandardOffset(java.time.Instant.parse("2025-01-15T12:00:00Z")).getId().replace("Z", "+00:00"));
            siteChanged();
        });
        zones.getSelectionModel().selectedItemProperty().addListener((o, a, b) -> {
            if (b != null && !b.equals(zoneSearch.getText())) zoneSearch.setText(b);
        });
        lat.textProperty().addListener((o, a, b) -> { draft.latitude = b; siteChanged(); });
        lon.textProperty().addListener((o, a, b) -> { draft.longitude = b; siteChanged(); });
        elev.textProperty().addListener((o, a, b) -> draft.elevation = b);
        return section("3 \u00b7 Site", new Field[] {Field.LATITUDE, Field.LONGITUDE, Field.ZONE, Field.ELEVATION},
                label("Latitude (\u00b0 north; south is negative)"), lat, error(Field.LATITUDE),
                label("Longitude (\u00b0 east; west is negative)"), lon, error(Field.LONGITUDE),
                label("Time zone (its standard time is used all year)"), zoneSearch, zones, zoneNote, error(Field.ZONE),
                label("Elevation (m above sea level)"), elev, error(Field.ELEVATION));
    }

    private Node climateSection() {
        ToggleGroup g = new ToggleGroup();
        clear.setToggleGroup(g);
        file.setToggleGroup(g);
        clear.setId("clear-sky");
        file.setId("climate-from-file");
        clearNote.setWrapText(true);
        clearNote.getStyleClass().add("caution");
        clearNote.setId("clear-sky-note");
        clearNote.managedProperty().bind(clearNote.visibleProperty());
        clearNote.visibleProperty().bind(clear.selectedProperty());
        climateFile.setPromptText("a weather file (CSV)");
        climateFile.disableProperty().bind(clear.selectedProperty());
        Button choose = new Button("Choose\u2026");
        choose.disableProperty().bind(clear.selectedProperty());
        choose.setOnAction(e -> {
            FileChooser fc = new FileChooser();
            fc.setTitle("Climate file");
            File f = fc.showOpenDialog(host.window());
            if (f != null) climateFile.setText(f.getAbsolutePath());
        });
        g.selectedToggleProperty().addListener((o, a, b) -> { draft.clearSky = b == clear; refreshPreview(); });
        climateFile.textProperty().addListener((o, a, b) -> draft.climateFile = b);
        climateFile.setOnAction(e -> refreshPreview());
        climateFile.focusedProperty().addListener((o, a, b) -> { if (!b) refreshPreview(); });
        zoneNote.getStyleClass().add("small");
        zoneNote.setWrapText(true);
        zoneNote.setId("zone-note");
        preview.setId("climate-preview");
        preview.managedProperty().bind(preview.visibleProperty());
        preview.visibleProperty().bind(file.selectedProperty());
        return section("4 \u00b7 Climate", new Field[] {Field.CLIMATE}, clear, clearNote, file,
                ViewerWindow.row(climateFile, choose), error(Field.CLIMATE), preview);
    }

    private Node analysisSection() {
        sky.setId("sky");
        sky.setMaxWidth(Double.MAX_VALUE);
        sky.setOnAction(e -> draft.sky = sky.getValue());
        patch.textProperty().addListener((o, a, b) -> { draft.patch = b; refreshEstimate(); });
        rays.textProperty().addListener((o, a, b) -> { draft.rays = b; refreshEstimate(); });
        map.selectedProperty().addListener((o, a, b) -> draft.map = b);
        gltf.selectedProperty().addListener((o, a, b) -> draft.gltf = b);
        monthHour.selectedProperty().addListener((o, a, b) -> { draft.monthHour = b; refreshEstimate(); });
        estimate.setWrapText(true);
        estimate.setId("estimate");
        estimate.getStyleClass().add("small");
        advice.setWrapText(true);
        advice.getStyleClass().add("field-error");
        advice.managedProperty().bind(advice.visibleProperty());
        return section("5 \u00b7 Analysis", new Field[] {Field.SKY, Field.PATCH, Field.RAYS},
                label("Sky model (how diffuse light spreads over the sky)"), sky, error(Field.SKY),
                label("Patch size (m): the grid on each surface"), patch, error(Field.PATCH),
                label("Rays per patch (more: smoother sky view, slower)"), rays, error(Field.RAYS),
                label("Also write"), map, gltf, monthHour, estimate, advice);
    }

    private Node runSection() {
        name.textProperty().addListener((o, a, b) -> draft.name = b);
        studyFile.textProperty().addListener((o, a, b) -> draft.studyFile = b);
        results.textProperty().addListener((o, a, b) -> draft.resultsFolder = b);
        variant.setPromptText("empty: a dated name");
        Button save = new Button("Save study"), run = new Button("Run");
        save.setId("save-study");
        run.setId("run-study");
        save.setOnAction(e -> save());
        run.setOnAction(e -> run());
        done.setWrapText(true);
        done.setId("setup-status");
        done.getStyleClass().add("small");
        return section("6 \u00b7 Save and run", new Field[] {Field.NAME, Field.STUDY_FILE, Field.RESULTS},
                label("Study name"), name, error(Field.NAME),
                label("Study file"), studyFile, error(Field.STUDY_FILE),
                label("Results folder (a later run goes into a new folder beside it)"), results, error(Field.RESULTS),
                label("Name of a later run's folder"), variant,
                ViewerWindow.row(save, run), done);
    }

    private void fillAxisAndUnit() {
        up.getSelectionModel().select(draft.up == UpAxis.Y ? 1 : 0);
        unit.setValue(draft.unit);
    }

    private void fillFromDraft() {
        fillAxisAndUnit();
        lat.setText(draft.latitude);
        lon.setText(draft.longitude);
        elev.setText(draft.elevation);
        zoneSearch.setText(draft.zone);
        (draft.clearSky ? clear : file).setSelected(true);
        climateFile.setText(draft.climateFile);
        sky.setValue(draft.sky);
        patch.setText(draft.patch);
        rays.setText(draft.rays);
        map.setSelected(draft.map);
        gltf.setSelected(draft.gltf);
        monthHour.setSelected(draft.monthHour);
        name.setText(draft.name);
        studyFile.setText(draft.studyFile);
        results.setText(draft.resultsFolder);
    }

    /** Reads the model with another axis or unit; when it does not read so, keeps the ones it reads with and says why. */
    private void reread(UpAxis newUp, LengthUnit newUnit) {
        if (newUp == draft.up && newUnit == draft.unit) return;
        try {
            model = ModelCheck.read(draft.modelFile, newUp, newUnit);
            draft.up = newUp;
            draft.unit = newUnit;
            show(Field.MODEL, null);
        } catch (RuntimeException ex) {
            show(Field.MODEL, "Read in " + ModelCheck.unitName(newUnit) + " with " + Study.Named.labelOf(newUp) + " up: "
                    + sentence(GuiWords.of(ex.getMessage().replaceFirst("^[^:]*:\\d+: ", ""))) + " It stays as it was.");
            fillAxisAndUnit();
            return;
        }
        refreshModel();
        host.draftChanged(draft, model);
    }

    /** Size line, suggestions, block list and estimate for the model as read now. */
    private void refreshModel() {
        double[] b = model.model().bounds();
        size.setText(String.format(Locale.ROOT, "As read: %,.1f m east-west \u00d7 %,.1f m north-south \u00d7 %,.1f m tall, %d blocks.",
                b[3] - b[0], b[4] - b[1], b[5] - b[2], draft.blocks.size()));
        size.setWrapText(true);
        size.getStyleClass().setAll("label", "small");
        suggestions.getChildren().clear();
        for (ModelCheck.Suggestion s : model.suggestions()) {
            Label l = new Label(s.text());
            l.setWrapText(true);
            l.getStyleClass().add("suggestion");
            suggestions.getChildren().add(l);
            if (s.unit() != null) {
                Button use = new Button("Use " + ModelCheck.unitName(s.unit()));
                use.setId("use-unit");
                use.setOnAction(e -> unit.setValue(s.unit()));
                suggestions.getChildren().add(use);
            }
            if (s.up() != null) {
                Button use = new Button("Use y as the vertical axis");
                use.setOnAction(e -> up.getSelectionModel().select(1));
                suggestions.getChildren().add(use);
            }
        }
        for (String n : model.notes()) suggestions.getChildren().add(small(GuiWords.of(n)));
        refreshBlocks();
        refreshEstimate();
    }

    /** The block list as the draft has it (after a click in the 3D view, too). */
    void refreshBlocks() {
        blockList.getChildren().clear();
        for (int i = 0; i < draft.blocks.size(); i++) {
            int k = i;
            CheckBox c = new CheckBox(draft.blocks.get(i) + String.format(Locale.ROOT, "  (%,.0f m\u00b2)", model.blockAreaM2()[i]));
            c.setId("block-" + i);
            c.setSelected(draft.analysed[i]);
            c.selectedProperty().addListener((o, a, b) -> {
                if (draft.analysed[k] != b) {
                    draft.toggle(k);
                    blocksChanged();
                }
            });
            blockList.getChildren().add(c);
        }
        show(Field.BLOCKS, null);
    }

    private void setAll(boolean analysed) {
        java.util.Arrays.fill(draft.analysed, analysed);
        refreshBlocks();
        blocksChanged();
    }

    /** A block was switched (in the list or the 3D view). */
    void blocksChanged() {
        refreshEstimate();
        host.draftChanged(draft, model);
    }

    /** Switches a block as a click in the 3D view does. */
    void toggleBlock(int block) {
        draft.toggle(block);
        refreshBlocks();
        blocksChanged();
    }

    private void siteChanged() {
        host.draftChanged(draft, model);
    }

    private void refreshEstimate() {
        double p = StudyDraft.parse(draft.patch), r = StudyDraft.parse(draft.rays);
        if (!(p > 0 && p <= 100) || !(r >= 1) || draft.analysedCount() == 0) {
            estimate.setText("The estimate of memory and time appears once the patch size, rays and blocks are set.");
            advice.setVisible(false);
            return;
        }
        ModelCheck.Estimate e = model.estimate(draft.analysed, p, (int) Math.min(1 << 20, r), draft.monthHour);
        estimate.setText(e.text());
        advice.setText(e.advice());
        advice.setVisible(!e.fits());
    }

    private void refreshPreview() {
        preview.getChildren().clear();
        show(Field.CLIMATE, null);
        if (draft.clearSky || draft.climateFile.isBlank()) return;
        Study s = studyFor(Field.CLIMATE);
        if (s == null) return;
        try {
            for (String line : ClimatePreview.lines(s)) {
                Label l = new Label(line);
                l.getStyleClass().add(line.startsWith("   ") ? "preview-row" : "small");
                l.setWrapText(!line.startsWith("   "));
                preview.getChildren().add(l);
            }
        } catch (RuntimeException ex) {
            show(Field.CLIMATE, GuiWords.of(ex.getMessage()));
        }
    }

    /** The draft's study, or null with the errors shown; {@code only} limits the errors shown to one field (null: all). */
    private Study studyFor(Field only) {
        try {
            Study s = draft.study();
            clearErrors();
            return s;
        } catch (StudyDraft.Incomplete ex) {
            if (only == null) {
                clearErrors();
                ex.errors.forEach(this::show);
                Field f = ex.errors.keySet().iterator().next();
                TitledPane first = sectionOf.get(f);
                if (first != null) first.setExpanded(true);
                done.setText(ex.errors.size() == 1 ? "One field needs a look: " + first.getText() + " (marked in red)."
                        : ex.errors.size() + " fields need a look, the first in " + first.getText() + " (marked in red).");
                scrollTo(errors.get(f));
            } else if (ex.errors.containsKey(only)) {
                show(only, ex.errors.get(only));
            } else if (only == Field.CLIMATE) {
                show(Field.CLIMATE, "The preview reads the file with the site's time zone: set the site first.");
            }
            return null;
        }
    }

    /** Scrolls the set-up so that a node is in view. */
    private void scrollTo(Node n) {
        javafx.scene.Parent up = getParent();
        while (up != null && !(up instanceof javafx.scene.control.ScrollPane)) up = up.getParent();
        if (!(up instanceof javafx.scene.control.ScrollPane sp)) return;
        applyCss();
        layout();
        double y = n.localToScene(0, 0).getY() - localToScene(0, 0).getY();
        double range = getHeight() - sp.getViewportBounds().getHeight();
        if (range > 0) sp.setVvalue(Math.max(0, Math.min(1, (y - 60) / range)));
    }

    private void clearErrors() {
        for (Field f : errors.keySet()) show(f, null);
    }

    private void show(Field f, String message) {
        Label l = errors.get(f);
        if (l == null) return;
        boolean on = message != null && !message.isBlank();
        l.setText(on ? message : "");
        l.setVisible(on);
        l.setManaged(on);
    }

    /** The error shown beside a field ("" when none), for tests. */
    String errorText(Field f) {
        return errors.get(f).getText();
    }

    private void save() {
        Study s = studyFor(null);
        if (s == null) return;
        try {
            done.setText(host.saveStudy(s, StudyDraft.path(draft.studyFile), org.solmass.study.StudyWriter.toJson(s)));
        } catch (Exception ex) {
            show(Field.STUDY_FILE, GuiWords.of(ex.getMessage()));
        }
    }

    private void run() {
        Study s = studyFor(null);
        if (s == null) return;
        ModelCheck.Estimate e = model.estimate(draft.analysed, s.patchM(), s.rays(), draft.monthHour);
        if (!e.fits()) {
            show(Field.PATCH, e.advice());
            sectionOf.get(Field.PATCH).setExpanded(true);
            return;
        }
        done.setText("");
        host.runStudy(s, variant.getText());
        variant.clear();   // a name is used once
    }

    /** After a run or a save: a line under the buttons. */
    void setDone(String text) {
        done.setText(text);
    }

    private static String sentence(String s) {
        return s.endsWith(".") ? s : s + ".";
    }

    private static TextField field(String id) {
        TextField t = new TextField();
        t.setId(id);
        return t;
    }

    private static Label label(String s) {
        Label l = new Label(s);
        l.getStyleClass().add("small");
        l.setWrapText(true);
        return l;
    }

    private static Label small(String s) {
        return label(s);
    }

    /** Sets a field as the user would type it (tests and scripts). */
    void type(Field f, String text) {
        switch (f) {
            case LATITUDE -> lat.setText(text);
            case LONGITUDE -> lon.setText(text);
            case ZONE -> zoneSearch.setText(text);
            case ELEVATION -> elev.setText(text);
            case CLIMATE -> { file.setSelected(true); climateFile.setText(text); refreshPreview(); }
            case PATCH -> patch.setText(text);
            case RAYS -> rays.setText(text);
            case NAME -> name.setText(text);
            case STUDY_FILE -> studyFile.setText(text);
            case RESULTS -> results.setText(text);
            default -> throw new IllegalArgumentException(f.toString());
        }
    }
}

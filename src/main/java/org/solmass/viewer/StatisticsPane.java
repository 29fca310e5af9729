package org.solmass.viewer;

import com.fasterxml.jackson.databind.JsonNode;
import javafx.beans.property.ReadOnlyObjectWrapper;
import javafx.geometry.Insets;
import javafx.geometry.Pos;
import javafx.scene.control.Button;
import javafx.scene.control.ComboBox;
import javafx.scene.control.Label;
import javafx.scene.control.TableColumn;
import javafx.scene.control.TableView;
import javafx.scene.layout.BorderPane;
import javafx.scene.layout.HBox;
import javafx.stage.FileChooser;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.solmass.output.AtomicFiles;
import org.solmass.output.SummaryWriter;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.function.Supplier;

/**
 * The "Statistics" tab: area-weighted statistics of the quantity on show per block, per facade
 * orientation, per storey band or per surface, as summary.json gives them (computed by
 * {@link SummaryWriter}, the one home of these statistics); columns sort on a click, and the table
 * exports to CSV (header row first).
 */
final class StatisticsPane extends BorderPane {
    /** The groupings: label shown and summary.json section. */
    static final Map<String, String> GROUPS = new java.util.LinkedHashMap<>();

    static {
        GROUPS.put("By block", "by_block");
        GROUPS.put("By facade orientation", "by_facade_orientation");
        GROUPS.put("By facade storey band", "by_facade_storey");
        GROUPS.put("By surface", "by_surface");
    }

    static final String[] HEADER = {"group", "patches", "area_m2", "mean", "min", "max", "total_kwh"};
    private final ComboBox<String> group = new ComboBox<>();
    private final TableView<String[]> table = new TableView<>();
    private final Label unit = new Label();
    private final Supplier<Quantity> quantity;
    private ViewerData data;
    private boolean active;
    private double storeyHeightM = SummaryWriter.Spec.DEFAULT_STOREY_HEIGHT_M;

    StatisticsPane(Supplier<Quantity> quantity) {
        this.quantity = quantity;
        group.getItems().setAll(GROUPS.keySet());
        group.getSelectionModel().select(0);
        group.setId("statistics-group");
        group.valueProperty().addListener((o, a, b) -> redraw());
        Button csv = new Button("CSV\u2026");
        csv.setId("statistics-csv");
        csv.setOnAction(e -> {
            FileChooser fc = new FileChooser();
            fc.setInitialFileName("statistics.csv");
            java.io.File f = fc.showSaveDialog(getScene() == null ? null : getScene().getWindow());
            if (f != null) writeCsv(f.toPath());
        });
        HBox top = new HBox(8, group, csv, unit);
        top.setAlignment(Pos.CENTER_LEFT);
        top.setPadding(new Insets(6, 8, 6, 8));
        setTop(top);
        table.setId("statistics-table");
        for (int c = 0; c < HEADER.length; c++) {
            final int k = c;
            TableColumn<String[], String> col = new TableColumn<>(HEADER[c]);
            col.setCellValueFactory(r -> new ReadOnlyObjectWrapper<>(r.getValue()[k]));
            if (c > 0) col.setComparator(StatisticsPane::numeric);
            col.setPrefWidth(c == 0 ? 160 : 100);
            table.getColumns().add(col);
        }
        table.setColumnResizePolicy(TableView.CONSTRAINED_RESIZE_POLICY_FLEX_LAST_COLUMN);
        setCenter(table);
    }

    /** Numbers by value, empty cells last. */
    static int numeric(String a, String b) {
        double x = a == null || a.isEmpty() ? Double.NaN : Double.parseDouble(a), y = b == null || b.isEmpty() ? Double.NaN : Double.parseDouble(b);
        if (Double.isNaN(x) || Double.isNaN(y)) return Boolean.compare(Double.isNaN(x), Double.isNaN(y));
        return Double.compare(x, y);
    }

    void setData(ViewerData d) {
        data = d;
        redraw();
    }

    void setActive(boolean on) {
        active = on;
        redraw();
    }

    /** Fills the table for the quantity and grouping on show. */
    void redraw() {
        Quantity q = quantity.get();
        if (!active || data == null || q == null) return;
        table.getItems().setAll(rows(data, q, GROUPS.get(group.getValue()), storeyHeightM));
        unit.setText(q.label() + (q.unit().isEmpty() ? "" : " (" + q.unit() + ")") + ", area-weighted");
    }

    /**
     * The rows of one grouping: name, patches, area, mean, min, max and, for a quantity in kWh/m2, the
     * total in kWh, as summary.json rounds them.
     */
    static List<String[]> rows(ViewerData d, Quantity q, String section, double storeyHeightM) {
        SummaryWriter.Spec spec = new SummaryWriter.Spec(List.of(q.column()), null, List.of(), storeyHeightM);
        JsonNode sec = SummaryWriter.toTree(d.table(), spec, null, List.of()).path(section);
        List<String[]> out = new ArrayList<>();
        for (Iterator<Map.Entry<String, JsonNode>> it = sec.fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> e = it.next();
            if (!e.getValue().isObject()) continue;
            JsonNode n = e.getValue(), v = n.path(q.column());
            out.add(new String[] {e.getKey(), text(n.path("patches")), text(n.path("area_m2")), text(v.path("mean")),
                    text(v.path("min")), text(v.path("max")), text(v.path("total_kwh"))});
        }
        return out;
    }

    private static String text(JsonNode n) {
        return n.isMissingNode() || n.isNull() ? "" : n.asText();
    }

    /** Writes the table as on show (its sort order) as CSV, header row first. */
    void writeCsv(Path file) {
        List<String[]> rows = new ArrayList<>(table.getItems());
        AtomicFiles.write(file, out -> {
            java.io.Writer w = new java.io.OutputStreamWriter(out, java.nio.charset.StandardCharsets.UTF_8);
            CSVPrinter p = new CSVPrinter(w, CSVFormat.DEFAULT.builder().setRecordSeparator("\n").get());
            p.printRecord((Object[]) HEADER);
            for (String[] r : rows) p.printRecord((Object[]) r);
            p.flush();
        });
    }

    List<String[]> items() { return List.copyOf(table.getItems()); }
}

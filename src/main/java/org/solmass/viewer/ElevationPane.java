package org.solmass.viewer;

import javafx.embed.swing.SwingFXUtils;
import javafx.geometry.Insets;
import javafx.geometry.Pos;
import javafx.scene.control.ComboBox;
import javafx.scene.control.Label;
import javafx.scene.control.ScrollPane;
import javafx.scene.image.ImageView;
import javafx.scene.layout.BorderPane;
import javafx.scene.layout.HBox;
import org.solmass.output.FacadeLayout;
import org.solmass.output.FacadeSheet;
import org.solmass.surface.Patch;

import java.util.ArrayList;
import java.util.List;
import java.util.function.Supplier;

/**
 * The "Facade elevations" tab: one analysed block's facades unrolled side by side, seen straight on
 * at one scale ({@link FacadeLayout}, drawn by {@link FacadeSheet}, the page the elevations command
 * writes), coloured by the quantity and range on show in the 3D view. Drawn when the tab is shown,
 * the block is changed or the colouring changes.
 */
final class ElevationPane extends BorderPane {
    private final ComboBox<String> block = new ComboBox<>();
    private final ImageView image = new ImageView();
    private final Label note = new Label();
    private final Supplier<Quantity> quantity;
    private final Supplier<ColourScale> scale;
    private ViewerData data;
    private boolean active;
    private final List<Integer> blockIds = new ArrayList<>();
    private final ScrollPane scroll;

    ElevationPane(Supplier<Quantity> quantity, Supplier<ColourScale> scale) {
        this.quantity = quantity;
        this.scale = scale;
        block.setId("elevation-block");
        block.valueProperty().addListener((o, a, b) -> redraw());
        HBox top = new HBox(8, new Label("Block"), block, note);
        top.setAlignment(Pos.CENTER_LEFT);
        top.setPadding(new Insets(6, 8, 6, 8));
        setTop(top);
        scroll = new ScrollPane(image);
        scroll.setPannable(true);
        setCenter(scroll);
        javafx.animation.PauseTransition settle = new javafx.animation.PauseTransition(javafx.util.Duration.millis(250));
        settle.setOnFinished(e -> redraw());
        scroll.viewportBoundsProperty().addListener((o, a, b) -> {
            if (Math.abs(a.getWidth() - b.getWidth()) > 8 || Math.abs(a.getHeight() - b.getHeight()) > 8) settle.playFromStart();
        });
    }

    /** The analysed blocks with facade patches of the data on show. */
    void setData(ViewerData d) {
        data = d;
        blockIds.clear();
        List<String> names = new ArrayList<>();
        boolean[] hasFacade = new boolean[d.model().blockNames().size()];
        for (Patch p : d.patches()) if (p.kind() == org.solmass.surface.SurfaceKind.FACADE) hasFacade[p.block()] = true;
        for (int b = 0; b < hasFacade.length; b++) {
            if (hasFacade[b] && d.blockAnalysed()[b]) {
                blockIds.add(b);
                names.add(d.model().blockNames().get(b));
            }
        }
        block.getItems().setAll(names);
        if (!names.isEmpty()) block.getSelectionModel().select(0);
        note.setText(names.isEmpty() ? "No analysed block has facade patches." : "");
        redraw();
    }

    /** Whether the tab is on show: only then is a page drawn. */
    void setActive(boolean on) {
        active = on;
        redraw();
    }

    /** Draws the chosen block's page again (after a change of quantity or range). */
    void redraw() {
        Quantity q = quantity.get();
        int k = block.getSelectionModel().getSelectedIndex();
        if (!active || data == null || q == null || k < 0) return;
        int b = blockIds.get(k);
        List<Patch> mine = new ArrayList<>();
        for (Patch p : data.patches()) if (p.block() == b) mine.add(p);
        ColourScale s = scale.get();
        // drawn at the size of the view (at least 800 x 560 pixels), so text and patch edges stay sharp
        int w = (int) Math.max(800, scroll.getViewportBounds().getWidth() - 2);
        int h = (int) Math.max(560, scroll.getViewportBounds().getHeight() - 2);
        FacadeSheet.Options o = new FacadeSheet.Options(w, h, data.title(), block.getValue(), q.label(),
                q.def().unit().symbol(), "", s.min(), s.max(), q.diverging(),
                "Range as in the 3D view; values beyond it take the end colours");
        image.setImage(SwingFXUtils.toFXImage(FacadeSheet.render(FacadeLayout.of(mine), data.table().column(q.column()), o), null));
    }
}

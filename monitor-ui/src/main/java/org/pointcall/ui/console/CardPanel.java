package org.pointcall.ui.console;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.function.Consumer;

import javafx.geometry.Pos;
import javafx.scene.control.Label;
import javafx.scene.control.ScrollPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.StackPane;
import javafx.scene.layout.VBox;
import javafx.scene.shape.SVGPath;

import org.pointcall.ui.desk.CardRow;

/** The test card: one row per point with its state as shape, word and colour; a selection the keys act on. */
final class CardPanel {
    private final VBox rows = new VBox(1);
    private final VBox node;
    private final List<Row> shown = new ArrayList<>();
    private final Consumer<String> onPick;
    private String selected;

    private static final class Row {
        final HBox box;
        final SVGPath mark;
        final Label word;
        final Label title;
        CardRow row;

        Row(CardRow r) {
            this.row = r;
            mark = Marks.of(r.mark(), 12);
            StackPane markBox = new StackPane(mark);
            markBox.setMinSize(18, 18);
            markBox.setMaxSize(18, 18);
            Label id = new Label(r.pointId());
            id.getStyleClass().add("point-id");
            word = new Label();
            word.getStyleClass().add("state-word");
            title = new Label(r.title());
            title.getStyleClass().add("point-title");
            VBox text = new VBox(0, new HBox(6, id, word), title);
            box = new HBox(6, markBox, text);
            box.setAlignment(Pos.CENTER_LEFT);
            box.getStyleClass().add("card-row");
            box.setId("card-row-" + r.pointId());
            word.setId("card-state-" + r.pointId());
            title.setId("card-row-" + r.pointId() + "-title");
            set(r);
        }

        void set(CardRow r) {
            row = r;
            Marks.restyle(mark, r.mark());
            word.setText(r.mark().word().toUpperCase(Locale.ROOT) + (r.note().isEmpty() ? "" : " \u2022"));
            word.getStyleClass().removeIf(c -> c.startsWith("word-"));
            word.getStyleClass().add("word-" + r.mark().name().toLowerCase(Locale.ROOT));
            title.setText(r.note().isEmpty() ? r.title() : r.title() + "  \u2014 " + r.note());
        }
    }

    CardPanel(Consumer<String> onPick) {
        this.onPick = onPick;
        Label head = new Label("TEST CARD");
        head.getStyleClass().add("panel-title");
        ScrollPane scroll = new ScrollPane(rows);
        scroll.setFitToWidth(true);
        scroll.setHbarPolicy(ScrollPane.ScrollBarPolicy.NEVER);
        VBox.setVgrow(scroll, Priority.ALWAYS);
        node = new VBox(2, head, scroll);
        node.getStyleClass().add("panel");
        node.setId("card-panel");
    }

    VBox node() {
        return node;
    }

    String selected() {
        return selected;
    }

    void show(List<CardRow> card) {
        boolean same = card.size() == shown.size();
        for (int i = 0; same && i < card.size(); i++) {
            same = card.get(i).pointId().equals(shown.get(i).row.pointId());
        }
        if (same) {
            for (int i = 0; i < card.size(); i++) {
                if (!card.get(i).equals(shown.get(i).row)) {
                    shown.get(i).set(card.get(i));
                }
            }
        } else {
            shown.clear();
            rows.getChildren().clear();
            for (CardRow r : card) {
                Row row = new Row(r);
                row.box.setOnMouseClicked(e -> {
                    select(r.pointId());
                    onPick.accept(r.pointId());
                });
                shown.add(row);
                rows.getChildren().add(row.box);
            }
            if (selected == null && !card.isEmpty()) {
                select(card.get(0).pointId());
            } else {
                select(selected);
            }
        }
    }

    void select(String pointId) {
        selected = pointId;
        for (Row r : shown) {
            r.box.getStyleClass().remove("selected");
            if (r.row.pointId().equals(pointId)) {
                r.box.getStyleClass().add("selected");
            }
        }
    }

    /** Moves the selection by {@code step} rows. */
    void move(int step) {
        if (shown.isEmpty()) {
            return;
        }
        int at = 0;
        for (int i = 0; i < shown.size(); i++) {
            if (shown.get(i).row.pointId().equals(selected)) {
                at = i;
            }
        }
        int to = Math.max(0, Math.min(shown.size() - 1, at + step));
        select(shown.get(to).row.pointId());
    }
}

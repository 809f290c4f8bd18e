package org.pointcall.ui.console;

import java.util.ArrayList;
import java.util.List;
import java.util.function.Function;

import javafx.geometry.Pos;
import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.control.ListView;
import javafx.scene.control.TextArea;
import javafx.scene.input.KeyCode;
import javafx.scene.input.MouseButton;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.VBox;

import org.pointcall.ui.settings.TraceGroup;

/**
 * The chart-group editor, over the charts: one group per line as {@code name: P1, P2, ...}, the stream's
 * parameters beside it (double-click or Enter puts one in at the caret), Apply (Ctrl+Enter) and Cancel (Esc).
 * What it applies is checked first; a problem is shown naming its line and nothing changes. JavaFX thread only.
 */
final class LanesPanel {
    private final VBox node = new VBox(6);
    private final TextArea text = new TextArea();
    private final ListView<String> available = new ListView<>();
    private final Label message = new Label();
    final Button apply = new Button("Apply  [Ctrl+Enter]");
    final Button cancel = new Button("Cancel  [Esc]");

    LanesPanel(List<String> parameters, Function<String, String> unitOf) {
        Label title = new Label("CHART GROUPS");
        title.getStyleClass().add("panel-title");
        Label help = new Label("One group per line, top to bottom:  name: parameter, parameter, ...");
        help.getStyleClass().add("lanes-help");
        text.setId("lanes-text");
        text.setPrefRowCount(8);
        text.setWrapText(false);
        HBox.setHgrow(text, Priority.ALWAYS);
        for (String p : parameters) {
            String u = unitOf.apply(p);
            available.getItems().add(u.isEmpty() ? p : p + "  [" + u + "]");
        }
        available.setId("lanes-available");
        available.setPrefWidth(220);
        available.setOnMouseClicked(e -> {
            if (e.getButton() == MouseButton.PRIMARY && e.getClickCount() == 2) {
                insertSelected();
            }
        });
        available.setOnKeyPressed(e -> {
            if (e.getCode() == KeyCode.ENTER) {
                insertSelected();
                e.consume();
            }
        });
        HBox body = new HBox(8, text, available);
        VBox.setVgrow(body, Priority.ALWAYS);
        message.setId("lanes-message");
        message.getStyleClass().add("lanes-message");
        message.setWrapText(true);
        apply.setId("lanes-apply");
        cancel.setId("lanes-cancel");
        HBox buttons = new HBox(8, apply, cancel);
        buttons.setAlignment(Pos.CENTER_RIGHT);
        node.getChildren().addAll(title, help, body, message, buttons);
        node.getStyleClass().add("lanes-panel");
        node.setId("lanes-panel");
        node.setMaxSize(900, 420);
        hide();
    }

    VBox node() {
        return node;
    }

    boolean showing() {
        return node.isVisible();
    }

    /** Opens the editor on the groups shown now. */
    void show(List<TraceGroup> groups) {
        StringBuilder b = new StringBuilder();
        for (TraceGroup g : groups) {
            b.append(g.text()).append('\n');
        }
        text.setText(b.toString());
        message.setText("");
        node.setVisible(true);
        node.setManaged(true);
        text.requestFocus();
        text.end();
    }

    void hide() {
        node.setVisible(false);
        node.setManaged(false);
    }

    /** Says why the groups were not applied. */
    void problem(String why) {
        message.setText(why);
    }

    /**
     * The groups written, or null with the problems shown (each naming its line): no line, a line that is not a
     * group, a parameter listed twice.
     */
    List<TraceGroup> groups() {
        List<TraceGroup> out = new ArrayList<>();
        List<String> problems = new ArrayList<>();
        java.util.Set<String> seen = new java.util.HashSet<>();
        String[] lines = text.getText().split("\n", -1);
        for (int i = 0; i < lines.length; i++) {
            String line = lines[i].strip();
            if (line.isEmpty() || line.startsWith("#")) {
                continue;
            }
            try {
                TraceGroup g = TraceGroup.parse(line);
                for (String p : g.parameters()) {
                    if (!seen.add(p)) {
                        problems.add("line " + (i + 1) + ": " + p + " is already in a group above");
                    }
                }
                out.add(g);
            } catch (IllegalArgumentException e) {
                problems.add("line " + (i + 1) + ": " + e.getMessage());
            }
        }
        if (out.isEmpty() && problems.isEmpty()) {
            problems.add("no group: write at least one line 'name: parameter, ...'");
        }
        if (!problems.isEmpty()) {
            message.setText(String.join("\n", problems));
            return null;
        }
        return out;
    }

    private void insertSelected() {
        String item = available.getSelectionModel().getSelectedItem();
        if (item == null) {
            return;
        }
        String name = item.contains("  [") ? item.substring(0, item.indexOf("  [")) : item;
        int caret = text.getCaretPosition();
        String before = text.getText().substring(0, caret).stripTrailing();
        boolean needComma = !before.isEmpty() && !before.endsWith(":") && !before.endsWith(",")
                && !before.endsWith("\n");
        text.insertText(caret, (needComma ? ", " : caret > 0 && !text.getText().substring(0, caret).endsWith(" ")
                && !before.endsWith("\n") ? " " : "") + name);
        text.requestFocus();
    }
}

package org.pointcall.ui.console;

import java.util.List;
import java.util.Locale;

import javafx.scene.control.Label;
import javafx.scene.control.ListCell;
import javafx.scene.control.ListView;
import javafx.scene.layout.Priority;
import javafx.scene.layout.VBox;

import org.pointcall.ui.desk.LogEntry;

/** The event log, newest at the bottom and kept in view. */
final class LogPanel {
    private final ListView<LogEntry> list = new ListView<>();
    private final VBox node;
    private List<LogEntry> shown = List.of();

    LogPanel() {
        Label head = new Label("EVENT LOG");
        head.getStyleClass().add("panel-title");
        list.getStyleClass().add("log-list");
        list.setId("event-log");
        list.setFocusTraversable(false);
        list.setCellFactory(v -> new ListCell<>() {
            @Override
            protected void updateItem(LogEntry e, boolean empty) {
                super.updateItem(e, empty);
                getStyleClass().removeIf(c -> c.startsWith("tag-"));
                if (empty || e == null) {
                    setText(null);
                    return;
                }
                setText(line(e));
                getStyleClass().add("tag-" + e.kind().name().toLowerCase(Locale.ROOT));
            }
        });
        VBox.setVgrow(list, Priority.ALWAYS);
        node = new VBox(2, head, list);
        node.getStyleClass().add("panel");
        node.setId("log-panel");
    }

    static String line(LogEntry e) {
        return LogLines.line(e);
    }

    VBox node() {
        return node;
    }

    ListView<LogEntry> list() {
        return list;
    }

    void show(List<LogEntry> log) {
        if (log.equals(shown)) {
            return;
        }
        shown = log;
        list.getItems().setAll(log);
        if (!log.isEmpty()) {
            list.scrollTo(log.size() - 1);
        }
    }
}

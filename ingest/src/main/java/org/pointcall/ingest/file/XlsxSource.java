package org.pointcall.ingest.file;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;
import java.util.TreeMap;

import javax.xml.parsers.ParserConfigurationException;

import org.apache.poi.EmptyFileException;
import org.apache.poi.openxml4j.exceptions.InvalidFormatException;
import org.apache.poi.openxml4j.exceptions.OLE2NotOfficeXmlFileException;
import org.apache.poi.openxml4j.exceptions.OpenXML4JException;
import org.apache.poi.openxml4j.opc.OPCPackage;
import org.apache.poi.openxml4j.opc.PackageAccess;
import org.apache.poi.openxml4j.opc.PackagePart;
import org.apache.poi.ss.usermodel.DateUtil;
import org.apache.poi.util.XMLHelper;
import org.apache.poi.xssf.eventusermodel.ReadOnlySharedStringsTable;
import org.apache.poi.xssf.eventusermodel.XSSFReader;
import org.apache.poi.xssf.model.SharedStrings;
import org.apache.poi.xssf.model.StylesTable;
import org.apache.poi.xssf.usermodel.XSSFCellStyle;
import org.pointcall.ingest.frame.FrameSink;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.error.Problem;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.xml.sax.Attributes;
import org.xml.sax.InputSource;
import org.xml.sax.SAXException;
import org.xml.sax.XMLReader;
import org.xml.sax.helpers.DefaultHandler;

/**
 * An XLSX time history, streamed with POI's event API: the sheet's XML is parsed with SAX as it is inflated from the
 * zip, the workbook is never built in memory (only the shared-string table and the styles are loaded, as the event
 * API does). The header is the first row with a value; times may be numbers of seconds, cells formatted as times or
 * dates, or text. Formula cells give their cached result. Spreadsheet rows are lines in problems; columns are
 * numbered from 1 (A) and named by cell reference in messages.
 */
public final class XlsxSource implements RecordedFileSource {
    private static final Logger LOG = LoggerFactory.getLogger(XlsxSource.class);

    private final String source;
    private final OPCPackage pkg;
    private final PackagePart sheet;
    private final SharedStrings strings;
    private final StylesTable styles;
    private final ColumnPlan plan;
    private final int headerRow;
    private final int slots;
    private final ReadOptions options;
    private volatile boolean stopRequested;
    private boolean used;
    private boolean closed;

    private XlsxSource(String source, OPCPackage pkg, PackagePart sheet, SharedStrings strings, StylesTable styles,
                       ColumnPlan plan, int headerRow, int slots, ReadOptions options) {
        this.source = source;
        this.pkg = pkg;
        this.sheet = sheet;
        this.strings = strings;
        this.styles = styles;
        this.plan = plan;
        this.headerRow = headerRow;
        this.slots = slots;
        this.options = options;
    }

    /**
     * Opens the workbook, finds the sheet ({@link ReadOptions#sheet()} or the first) and binds its header row.
     *
     * @throws InputRejectedException with every problem found when the file is not a readable workbook, has no
     *                                such sheet or its header does not fit the dictionary
     */
    public static XlsxSource open(Path file, ParameterDictionary dictionary, ReadOptions options) {
        Objects.requireNonNull(file, "file");
        Objects.requireNonNull(dictionary, "dictionary");
        Objects.requireNonNull(options, "options");
        String source = options.sourceName() != null ? options.sourceName() : file.toString();
        if (Files.isDirectory(file)) {
            throw rejected(source, "is a directory, not a file");
        }
        if (!Files.exists(file)) {
            throw rejected(source, "cannot read: no such file");
        }
        if (!Files.isReadable(file)) {
            throw rejected(source, "cannot read: permission denied");
        }
        OPCPackage pkg;
        try {
            pkg = OPCPackage.open(file.toFile(), PackageAccess.READ);
        } catch (OLE2NotOfficeXmlFileException e) {
            throw rejected(source, "this is an old binary Excel (.xls) file; save it as .xlsx or .csv");
        } catch (EmptyFileException e) {
            throw rejected(source, "empty file: not a spreadsheet");
        } catch (InvalidFormatException | RuntimeException e) {
            throw rejected(source, "not a spreadsheet: not a readable .xlsx workbook (zip of spreadsheet parts)");
        }
        try {
            XSSFReader reader = new XSSFReader(pkg);
            PackagePart chosen = null;
            List<String> names = new ArrayList<>();
            PackagePart folded = null;
            XSSFReader.SheetIterator it = reader.getSheetIterator();
            while (it.hasNext()) {
                // the iterator opens each sheet's stream; only the name and part are wanted here
                it.next().close();
                String name = it.getSheetName();
                names.add(name);
                if (chosen == null && (options.sheet() == null || name.equals(options.sheet()))) {
                    chosen = it.getSheetPart();
                } else if (folded == null && options.sheet() != null
                        && HeaderBinder.fold(name).equals(HeaderBinder.fold(options.sheet()))) {
                    folded = it.getSheetPart();
                }
            }
            if (chosen == null) {
                chosen = folded;
            }
            if (chosen == null) {
                throw rejected(source, names.isEmpty() ? "the workbook has no sheet"
                        : "no sheet named '" + options.sheet() + "'; the workbook has '" + String.join("', '", names)
                        + "'");
            }
            SharedStrings strings = new ReadOnlySharedStringsTable(pkg);
            StylesTable styles = styleTableOrNull(reader);

            SheetHandler header = new SheetHandler(null, null, null, strings, styles, 0, -1);
            parse(chosen, header);
            if (header.headerRow < 0) {
                throw rejected(source, "the sheet is empty: no header row");
            }
            int width = header.headerCells.isEmpty() ? 0 : header.headerCells.lastKey() + 1;
            List<String> headers = new ArrayList<>(width);
            int[] positions = new int[width];
            String[] letters = new String[width];
            for (int c = 0; c < width; c++) {
                headers.add(header.headerCells.getOrDefault(c, "").trim());
                positions[c] = c + 1;
                letters[c] = columnLetters(c);
            }
            ColumnPlan plan = HeaderBinder.bind(source, header.headerRow, headers, positions, letters, dictionary,
                    options);
            CsvSource.logBinding(plan.binding);
            return new XlsxSource(source, pkg, chosen, strings, styles, plan, header.headerRow, dictionary.size(),
                    options);
        } catch (InputRejectedException e) {
            pkg.revert();
            throw e;
        } catch (IOException | OpenXML4JException | SAXException | RuntimeException e) {
            pkg.revert();
            throw rejected(source, "not a spreadsheet: the workbook's parts cannot be read ("
                    + e.getClass().getSimpleName() + ")");
        }
    }

    @Override
    public HeaderBinding binding() {
        return plan.binding;
    }

    @Override
    public ReadReport readAll(FrameSink sink) {
        Objects.requireNonNull(sink, "sink");
        if (used || closed) {
            throw new IllegalStateException(source + " was already read or closed");
        }
        used = true;
        RowDecoder decoder = new RowDecoder(source, plan, slots,
                new ProblemLog(source, options.problemLimit(), LOG), false);
        SheetHandler handler = new SheetHandler(this, decoder, sink, strings, styles, plan.width, headerRow);
        try {
            parse(sheet, handler);
        } catch (IOException | SAXException | RuntimeException e) {
            decoder.failed(handler.row + 1, "the sheet cannot be read on after row " + handler.row + " ("
                    + e.getClass().getSimpleName() + (e.getMessage() == null ? "" : ": " + e.getMessage())
                    + "); the rest of the sheet is not read");
        }
        if (handler.sinkFailure != null) {
            throw handler.sinkFailure;
        }
        if (handler.stopped) {
            decoder.stopped();
        }
        return decoder.report();
    }

    @Override
    public void stop() {
        stopRequested = true;
    }

    @Override
    public void close() {
        if (!closed) {
            closed = true;
            pkg.revert();
        }
    }

    private static void parse(PackagePart part, SheetHandler handler) throws IOException, SAXException {
        try (InputStream in = part.getInputStream()) {
            XMLReader xml = XMLHelper.newXMLReader();
            xml.setContentHandler(handler);
            xml.parse(new InputSource(in));
        } catch (StopParsing e) {
            // the handler has what it wanted
        } catch (ParserConfigurationException e) {
            throw new SAXException(e);
        }
    }

    private static StylesTable styleTableOrNull(XSSFReader reader) {
        try {
            return reader.getStylesTable();
        } catch (IOException | InvalidFormatException | RuntimeException e) {
            return null;
        }
    }

    private static InputRejectedException rejected(String source, String message) {
        return new InputRejectedException(List.of(new Problem(source, 0, 0, message)));
    }

    /** 0 -> A, 25 -> Z, 26 -> AA. */
    static String columnLetters(int column) {
        StringBuilder sb = new StringBuilder();
        int c = column + 1;
        while (c > 0) {
            int r = (c - 1) % 26;
            sb.append((char) ('A' + r));
            c = (c - 1) / 26;
        }
        return sb.reverse().toString();
    }

    /** Ends a parse early without a stack trace: the header is found, or a stop was asked for. */
    private static final class StopParsing extends SAXException {
        private static final long serialVersionUID = 1L;

        @Override
        public synchronized Throwable fillInStackTrace() {
            return this;
        }
    }

    /**
     * SAX handler of one sheet. In header mode ({@code decoder == null}) it keeps the first row with a value and
     * stops; in data mode it hands each later row to the decoder.
     */
    private static final class SheetHandler extends DefaultHandler implements RowCells {
        private final XlsxSource owner;
        private final RowDecoder decoder;
        private final FrameSink sink;
        private final SharedStrings strings;
        private final StylesTable styles;
        private final int width;
        private final int skipThrough;
        private final StringBuilder[] text;
        private final byte[] kind;
        private final StringBuilder scratch = new StringBuilder();
        private byte[] dateStyle = new byte[0];

        final TreeMap<Integer, String> headerCells = new TreeMap<>();
        int headerRow = -1;
        int row;
        boolean stopped;
        RuntimeException sinkFailure;
        private int lastRow;
        private int nextColumn;
        private boolean rowHasValue;
        private int column;
        private String type;
        private int style;
        private StringBuilder cell;
        private boolean inCell;
        private boolean inValue;
        private boolean inInline;
        private boolean inPhonetic;

        SheetHandler(XlsxSource owner, RowDecoder decoder, FrameSink sink, SharedStrings strings,
                     StylesTable styles, int width, int skipThrough) {
            this.owner = owner;
            this.decoder = decoder;
            this.sink = sink;
            this.strings = strings;
            this.styles = styles;
            this.width = width;
            this.skipThrough = skipThrough;
            this.text = new StringBuilder[width];
            for (int i = 0; i < width; i++) {
                text[i] = new StringBuilder(24);
            }
            this.kind = new byte[width];
            this.lastRow = Math.max(skipThrough, 0);
        }

        @Override
        public void startElement(String uri, String localName, String qName, Attributes atts) {
            switch (local(localName, qName)) {
                case "row" -> {
                    String r = atts.getValue("r");
                    row = r != null ? parseInt(r, row + 1) : row + 1;
                    nextColumn = 0;
                    rowHasValue = false;
                    Arrays.fill(kind, RowCells.BLANK);
                }
                case "c" -> {
                    String ref = atts.getValue("r");
                    column = ref != null ? columnOf(ref, nextColumn) : nextColumn;
                    nextColumn = column + 1;
                    type = atts.getValue("t");
                    String s = atts.getValue("s");
                    style = s != null ? parseInt(s, 0) : 0;
                    cell = decoder != null && column < width ? text[column] : scratch;
                    cell.setLength(0);
                    inCell = true;
                }
                case "v" -> inValue = inCell;
                case "is" -> inInline = inCell;
                case "rPh" -> inPhonetic = true;
                case "t" -> inValue = inInline && !inPhonetic;
                default -> {
                }
            }
        }

        @Override
        public void characters(char[] ch, int start, int length) {
            if (inValue) {
                cell.append(ch, start, length);
            }
        }

        @Override
        public void endElement(String uri, String localName, String qName) throws SAXException {
            switch (local(localName, qName)) {
                case "v", "t" -> inValue = false;
                case "is" -> inInline = false;
                case "rPh" -> inPhonetic = false;
                case "c" -> endCell();
                case "row" -> endRow();
                default -> {
                }
            }
        }

        private void endCell() {
            inCell = false;
            inValue = false;
            byte k;
            if ("s".equals(type)) {
                int idx = parseInt(cell, -1);
                String s = null;
                if (idx >= 0) {
                    try {
                        s = strings.getItemAt(idx).getString();
                    } catch (RuntimeException e) {
                        s = null;
                    }
                }
                cell.setLength(0);
                if (s == null) {
                    cell.append("#BAD-STRING-INDEX");
                    k = RowCells.ERROR;
                } else {
                    cell.append(s);
                    k = RowCells.TEXT;
                }
            } else if ("e".equals(type)) {
                k = RowCells.ERROR;
            } else if (type == null || "n".equals(type)) {
                k = cell.length() > 0 && isDateStyle(style) ? RowCells.DAYS : RowCells.TEXT;
            } else {
                k = RowCells.TEXT;
            }
            if (isBlank(cell)) {
                k = RowCells.BLANK;
            }
            if (decoder == null) {
                if (k != RowCells.BLANK) {
                    headerCells.put(column, cell.toString());
                    rowHasValue = true;
                }
                return;
            }
            if (row <= skipThrough) {
                return;
            }
            if (column < width) {
                kind[column] = k;
                rowHasValue |= k != RowCells.BLANK;
            } else if (k != RowCells.BLANK) {
                decoder.outsideHeader(row, column + 1, columnLetters(column) + row);
            }
        }

        private void endRow() throws SAXException {
            if (decoder == null) {
                if (rowHasValue) {
                    headerRow = row;
                    throw new StopParsing();
                }
                return;
            }
            if (row <= skipThrough) {
                return;
            }
            if (row > lastRow + 1) {
                decoder.blankLines(row - lastRow - 1L);
            }
            lastRow = row;
            if (rowHasValue) {
                decoder.startDataRow();
                try {
                    decoder.decode(this, row, sink);
                } catch (RuntimeException e) {
                    // the sink's failure is the caller's, not the file's: carry it out of the parser unchanged
                    sinkFailure = e;
                    throw new StopParsing();
                }
            } else {
                decoder.blankLines(1);
            }
            if (owner.stopRequested) {
                stopped = true;
                throw new StopParsing();
            }
        }

        private boolean isDateStyle(int index) {
            if (styles == null || index < 0) {
                return false;
            }
            if (index >= dateStyle.length) {
                dateStyle = Arrays.copyOf(dateStyle, Math.max(index + 1, styles.getNumCellStyles()));
            }
            if (dateStyle[index] == 0) {
                boolean date = false;
                try {
                    XSSFCellStyle st = styles.getStyleAt(index);
                    date = st != null && DateUtil.isADateFormat(st.getDataFormat(), st.getDataFormatString());
                } catch (RuntimeException e) {
                    date = false;
                }
                dateStyle[index] = (byte) (date ? 1 : 2);
            }
            return dateStyle[index] == 1;
        }

        @Override
        public byte kind(int c) {
            return kind[c];
        }

        @Override
        public CharSequence text(int c) {
            return text[c];
        }

        @Override
        public int textStart(int c) {
            return 0;
        }

        @Override
        public int textEnd(int c) {
            return text[c].length();
        }

        @Override
        public int position(int c) {
            return c + 1;
        }

        @Override
        public String cellReference(int c) {
            return columnLetters(c) + row;
        }
    }

    private static String local(String localName, String qName) {
        if (localName != null && !localName.isEmpty()) {
            return localName;
        }
        int colon = qName.indexOf(':');
        return colon < 0 ? qName : qName.substring(colon + 1);
    }

    private static boolean isBlank(CharSequence s) {
        for (int i = 0; i < s.length(); i++) {
            if (!Character.isWhitespace(s.charAt(i)) && s.charAt(i) != '\u00a0') {
                return false;
            }
        }
        return true;
    }

    /** Column index of a cell reference such as {@code AB12}, or {@code fallback} when it has no letters. */
    private static int columnOf(String ref, int fallback) {
        int c = 0;
        int i = 0;
        while (i < ref.length()) {
            char ch = ref.charAt(i);
            if (ch >= 'A' && ch <= 'Z') {
                c = c * 26 + (ch - 'A' + 1);
            } else if (ch >= 'a' && ch <= 'z') {
                c = c * 26 + (ch - 'a' + 1);
            } else {
                break;
            }
            if (c > 1 << 20) {
                return fallback;
            }
            i++;
        }
        return i == 0 ? fallback : c - 1;
    }

    private static int parseInt(CharSequence s, int fallback) {
        int v = 0;
        if (s.length() == 0 || s.length() > 9) {
            return fallback;
        }
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            if (c < '0' || c > '9') {
                return fallback;
            }
            v = v * 10 + (c - '0');
        }
        return v;
    }
}

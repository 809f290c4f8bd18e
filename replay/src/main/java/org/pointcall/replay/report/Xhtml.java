package org.pointcall.replay.report;

/** A well-formed XHTML document built by appending: every text goes through {@link #text}, so it is escaped. */
final class Xhtml {
    private final StringBuilder b = new StringBuilder(1 << 16);

    /** Opens an element; {@code attrs} are name, value pairs (a null value leaves the attribute out). */
    Xhtml open(String tag, String... attrs) {
        b.append('<').append(tag);
        attributes(attrs);
        b.append('>');
        return this;
    }

    /** An element holding only text. */
    Xhtml el(String tag, String text, String... attrs) {
        open(tag, attrs);
        text(text);
        return close(tag);
    }

    /** An empty element ({@code <img/>}). */
    Xhtml empty(String tag, String... attrs) {
        b.append('<').append(tag);
        attributes(attrs);
        b.append("/>");
        return this;
    }

    Xhtml close(String tag) {
        b.append("</").append(tag).append('>');
        return this;
    }

    Xhtml text(String s) {
        b.append(escape(s == null ? "" : s));
        return this;
    }

    /** Markup that is already well formed (the style sheet, a fixed fragment). */
    Xhtml raw(String s) {
        b.append(s);
        return this;
    }

    private void attributes(String[] attrs) {
        if (attrs.length % 2 != 0) {
            throw new IllegalArgumentException("attributes come in name, value pairs");
        }
        for (int i = 0; i < attrs.length; i += 2) {
            if (attrs[i + 1] != null) {
                b.append(' ').append(attrs[i]).append("=\"").append(escape(attrs[i + 1])).append('"');
            }
        }
    }

    /** XML-escaped text; characters XML 1.0 does not allow are dropped. */
    static String escape(String s) {
        StringBuilder o = new StringBuilder(s.length() + 16);
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '&' -> o.append("&amp;");
                case '<' -> o.append("&lt;");
                case '>' -> o.append("&gt;");
                case '"' -> o.append("&quot;");
                case '\'' -> o.append("&#39;");
                default -> {
                    if (c >= 0x20 || c == '\n' || c == '\t' || c == '\r') {
                        o.append(c);
                    }
                }
            }
        }
        return o.toString();
    }

    @Override
    public String toString() {
        return b.toString();
    }
}

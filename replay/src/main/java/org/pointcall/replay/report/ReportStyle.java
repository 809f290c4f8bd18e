package org.pointcall.replay.report;

/** The report's style sheet: one for screen and paper; the page rules are read by the PDF layout only. */
final class ReportStyle {
    private ReportStyle() {
    }

    static String css(String sortie) {
        String footer = sortie.replace("\\", "").replace("\"", "'");
        return """
            @page { size: A4; margin: 15mm 13mm 17mm 13mm;
              @bottom-left { content: "pointcall debrief, sortie %s"; font-family: sans-serif; font-size: 7.5pt;
                color: #555555; }
              @bottom-right { content: "page " counter(page) " of " counter(pages); font-family: sans-serif;
                font-size: 7.5pt; color: #555555; } }
            body { font-family: sans-serif; font-size: 9pt; color: #1a1a1a; line-height: 1.3; }
            @media screen { body { max-width: 1100px; margin: 1.5em auto; padding: 0 1em; font-size: 10.5pt; } }
            h1 { font-size: 17pt; margin: 0 0 2pt 0; color: #1f3b73; }
            h2 { font-size: 12.5pt; margin: 14pt 0 5pt 0; color: #1f3b73; border-bottom: 1px solid #1f3b73;
              padding-bottom: 1pt; page-break-after: avoid; }
            h3 { font-size: 11pt; margin: 0 0 2pt 0; page-break-after: avoid; }
            p { margin: 3pt 0 5pt 0; }
            p.sub { color: #555555; margin-top: 0; }
            p.lead { color: #333333; }
            p.missing { color: #8a5a00; font-style: italic; }
            p.config { font-style: italic; color: #333333; }
            .caution { border: 1.5px solid #b35c00; background-color: #fff4e5; padding: 5pt 7pt; margin: 7pt 0;
              page-break-inside: avoid; }
            table { border-collapse: collapse; width: 100%%; margin: 3pt 0 7pt 0; -fs-table-paginate: paginate;
              -fs-page-break-min-height: 3cm; }
            div.point table { font-size: 8pt; margin: 2pt 0 4pt 0; }
            div.point th, div.point td { padding: 1pt 3pt; }
            th, td { border: 0.5pt solid #b0b0b0; padding: 2pt 4pt; vertical-align: top; text-align: left; }
            thead th { background-color: #e8edf5; }
            tr { page-break-inside: avoid; }
            table.facts th { width: 28%%; background-color: #f3f3f3; font-weight: bold; }
            td.num { text-align: right; white-space: nowrap; }
            td.flag { color: #8a2a00; font-weight: bold; }
            td.how { color: #444444; font-size: 8pt; }
            tr.out td { background-color: #fdecea; }
            tr.alarm td { background-color: #fdecea; }
            tr.not-flown td { color: #666666; font-style: italic; }
            ul { margin: 2pt 0 4pt 0; padding-left: 14pt; }
            ul.reasons { margin: 0; padding-left: 11pt; }
            pre.notes { font-family: sans-serif; white-space: pre-wrap; background-color: #f6f6f6; padding: 4pt;
              margin: 2pt 0; }
            span.v { font-weight: bold; padding: 0 3pt; white-space: nowrap; }
            span.good { color: #ffffff; background-color: #2e7d32; }
            span.repeat { color: #ffffff; background-color: #c62828; }
            span.incomplete { color: #1a1a1a; background-color: #ffb74d; }
            span.none { color: #666666; }
            div.point { page-break-before: always; }
            div.figure { margin: 4pt 0; page-break-inside: avoid; }
            img.figure { width: 100%%; }
            p.extras { font-size: 8pt; color: #444444; }
            div.why { color: #8a2a00; margin: 3pt 0; }
            div.closing { page-break-before: always; }
            a { color: #1f3b73; text-decoration: none; }
            """.formatted(footer);
    }
}

package org.solmass.output;

import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.PDDocumentInformation;
import org.apache.pdfbox.pdmodel.PDPage;
import org.apache.pdfbox.pdmodel.PDPageContentStream;
import org.apache.pdfbox.pdmodel.common.PDRectangle;
import org.apache.pdfbox.pdmodel.font.PDFont;
import org.apache.pdfbox.pdmodel.font.PDType1Font;
import org.apache.pdfbox.pdmodel.font.Standard14Fonts;
import org.apache.pdfbox.pdmodel.graphics.image.LosslessFactory;
import org.apache.pdfbox.pdmodel.graphics.image.PDImageXObject;

import java.awt.Color;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Calendar;
import java.util.GregorianCalendar;
import java.util.List;
import java.util.TimeZone;

/**
 * A flowing A4 landscape document on Apache PDFBox: headings, wrapped paragraphs, bullet lists,
 * key-value lists, tables that continue on the next page with their header repeated, and pictures
 * fitted to a page; a footer with the page number on every page. Text is set in the PDF standard
 * Helvetica (WinAnsi encoding, no font file needed on any machine); a character outside WinAnsi is
 * written as its nearest ASCII spelling ({@link #safe}). Written atomically.
 */
public final class PdfPages implements AutoCloseable {
    /** A4 landscape, points. */
    static final PDRectangle SIZE = new PDRectangle(PDRectangle.A4.getHeight(), PDRectangle.A4.getWidth());
    static final float MARGIN = 40, FOOTER = 28;
    private static final Color TEXT = new Color(0x1E1E1E), GREY = new Color(0x555555), RULE = new Color(0xC8C8C8);

    /** PDFBox logs which system font it would draw Helvetica with; the PDF names the standard font either way. */
    private static final java.util.logging.Logger FONT_LOG = java.util.logging.Logger.getLogger("org.apache.pdfbox.pdmodel.font.PDType1Font");

    static {
        FONT_LOG.setLevel(java.util.logging.Level.SEVERE);
    }

    private final PDDocument doc = new PDDocument();
    private final PDFont regular = new PDType1Font(Standard14Fonts.FontName.HELVETICA);
    private final PDFont bold = new PDType1Font(Standard14Fonts.FontName.HELVETICA_BOLD);
    private final String footer;
    private PDPageContentStream cs;
    private float y;

    /** @param footer text at the foot of every page, left of the page number */
    public PdfPages(String title, String footer) {
        this.footer = footer;
        PDDocumentInformation info = doc.getDocumentInformation();
        info.setTitle(safe(title));
        info.setCreator("Solmass");
    }

    /** Width of the text column, points. */
    public float width() { return SIZE.getWidth() - 2 * MARGIN; }

    /** Starts a new page. */
    public void newPage() {
        try {
            if (cs != null) cs.close();
            PDPage p = new PDPage(SIZE);
            doc.addPage(p);
            cs = new PDPageContentStream(doc, p);
            y = SIZE.getHeight() - MARGIN;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private void need(float h) {
        if (cs == null || y - h < MARGIN + FOOTER) newPage();
    }

    /** A heading; {@code level} 1 (page title) or 2 (section). */
    public void heading(String text, int level) {
        float size = level == 1 ? 20 : 14;
        need(size * 2.6f);
        y -= level == 1 ? 4 : 10;
        line(bold, size, TEXT, MARGIN, y - size, text);
        y -= size * 1.5f;
    }

    /** A paragraph wrapped to the column. */
    public void paragraph(String text, float size, boolean grey) {
        for (String l : wrap(text, regular, size, width())) {
            need(size * 1.35f);
            line(regular, size, grey ? GREY : TEXT, MARGIN, y - size, l);
            y -= size * 1.35f;
        }
        y -= size * 0.5f;
    }

    /** A bullet list, each item wrapped with a hanging indent. */
    public void bullets(List<String> items, float size) {
        for (String item : items) {
            List<String> lines = wrap(item, regular, size, width() - 14);
            for (int k = 0; k < lines.size(); k++) {
                need(size * 1.35f);
                if (k == 0) line(regular, size, TEXT, MARGIN + 2, y - size, "-");
                line(regular, size, TEXT, MARGIN + 14, y - size, lines.get(k));
                y -= size * 1.35f;
            }
            y -= size * 0.3f;
        }
        y -= size * 0.4f;
    }

    /** Key-value lines: the key in bold in a column of {@code keyWidth} points, the value wrapped beside it. */
    public void keyValues(List<String[]> rows, float size, float keyWidth) {
        for (String[] r : rows) {
            List<String> lines = wrap(r[1], regular, size, width() - keyWidth);
            for (int k = 0; k < lines.size(); k++) {
                need(size * 1.4f);
                if (k == 0) line(bold, size, TEXT, MARGIN, y - size, r[0]);
                line(regular, size, TEXT, MARGIN + keyWidth, y - size, lines.get(k));
                y -= size * 1.4f;
            }
        }
        y -= size * 0.6f;
    }

    /**
     * A table: header row in bold over a rule, then the rows; columns of the given relative widths,
     * numbers (cells flagged in {@code right}) aligned right; cells too long for their column are
     * shortened with "...". A table longer than the page continues on the next with its header.
     *
     * @param relWidths relative column widths, or null for widths in proportion to each column's widest text
     */
    public void table(String[] header, List<String[]> rows, float[] relWidths, boolean[] right, float size) {
        if (relWidths == null) {
            relWidths = new float[header.length];
            for (int i = 0; i < header.length; i++) {
                float m = textWidth(bold, size, header[i]);
                for (String[] r : rows) if (i < r.length && r[i] != null) m = Math.max(m, textWidth(regular, size, r[i]));
                relWidths[i] = m + 12;
            }
        }
        float total = 0;
        for (float f : relWidths) total += f;
        float[] w = new float[relWidths.length];
        for (int i = 0; i < w.length; i++) w[i] = relWidths[i] / total * width();
        float rowH = size * 1.5f;
        need(rowH * 3);
        tableRow(header, w, right, bold, size);
        for (String[] r : rows) {
            if (y - rowH < MARGIN + FOOTER) {
                newPage();
                tableRow(header, w, right, bold, size);
            }
            tableRow(r, w, right, regular, size);
        }
        y -= size;
    }

    private void tableRow(String[] cells, float[] w, boolean[] right, PDFont font, float size) {
        float x = MARGIN, rowH = size * 1.5f;
        for (int i = 0; i < w.length && i < cells.length; i++) {
            String s = fit(cells[i] == null ? "" : cells[i], font, size, w[i] - 6);
            float tw = textWidth(font, size, s);
            line(font, size, TEXT, right[i] ? x + w[i] - 4 - tw : x + 2, y - size, s);
            x += w[i];
        }
        y -= rowH;
        try {
            cs.setStrokingColor(RULE);
            cs.setLineWidth(font == bold ? 0.9f : 0.3f);
            cs.moveTo(MARGIN, y + size * 0.3f);
            cs.lineTo(MARGIN + width(), y + size * 0.3f);
            cs.stroke();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /**
     * A picture on a page of its own, as large as the page allows below its heading (aspect kept), with
     * a caption under it.
     */
    public void picture(String heading, BufferedImage img, String caption) {
        newPage();
        heading(heading, 2);
        try {
            PDImageXObject x = LosslessFactory.createFromImage(doc, img);
            float captionH = caption == null ? 0 : 12 * 1.35f * wrap(caption, regular, 9, width()).size() + 8;
            float maxW = width(), maxH = y - MARGIN - FOOTER - captionH;
            float s = Math.min(maxW / img.getWidth(), maxH / img.getHeight());
            float w = img.getWidth() * s, h = img.getHeight() * s;
            cs.drawImage(x, MARGIN + (maxW - w) / 2, y - h, w, h);
            y -= h + 8;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        if (caption != null) paragraph(caption, 9, true);
    }

    /** Vertical space, points. */
    public void space(float pt) { y -= pt; }

    private void line(PDFont font, float size, Color c, float x, float baseline, String text) {
        try {
            cs.beginText();
            cs.setFont(font, size);
            cs.setNonStrokingColor(c);
            cs.newLineAtOffset(x, baseline);
            cs.showText(safe(text));
            cs.endText();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static float textWidth(PDFont font, float size, String s) {
        try {
            return font.getStringWidth(safe(s)) / 1000 * size;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** Words of {@code text} in lines no wider than {@code width} points (a longer word stands alone, cut). */
    static List<String> wrap(String text, PDFont font, float size, float width) {
        List<String> out = new ArrayList<>();
        for (String para : safe(text).split("\n")) {
            StringBuilder cur = new StringBuilder();
            for (String word : para.split(" ")) {
                if (word.isEmpty()) continue;
                String cand = cur.length() == 0 ? word : cur + " " + word;
                if (textWidth(font, size, cand) <= width || cur.length() == 0) {
                    cur.setLength(0);
                    cur.append(fit(cand, font, size, width));
                } else {
                    out.add(cur.toString());
                    cur.setLength(0);
                    cur.append(fit(word, font, size, width));
                }
            }
            out.add(cur.toString());
        }
        return out;
    }

    private static String fit(String s, PDFont font, float size, float width) {
        if (textWidth(font, size, s) <= width) return s;
        String t = s;
        while (t.length() > 1 && textWidth(font, size, t + "...") > width) t = t.substring(0, t.length() - 1);
        return t + "...";
    }

    /**
     * Text the standard fonts can show (WinAnsi): dashes, quotes, degree, superscript two and the like
     * are kept; a few symbols are spelt out (minus, >=, <=, arrows); any other character becomes '?'.
     */
    public static String safe(String s) {
        StringBuilder b = new StringBuilder(s.length());
        s.codePoints().forEach(c -> {
            switch (c) {
                case 0x2212 -> b.append('-');
                case 0x2265 -> b.append(">=");
                case 0x2264 -> b.append("<=");
                case 0x2192 -> b.append("->");
                case 0x2190 -> b.append("<-");
                case '\t', '\r' -> b.append(' ');
                case '\n' -> b.append('\n');
                default -> b.append(winAnsi(c) ? Character.toString(c) : "?");
            }
        });
        return b.toString();
    }

    private static boolean winAnsi(int c) {
        if (c >= 0x20 && c < 0x7F) return true;
        if (c >= 0xA0 && c <= 0xFF) return true;
        return switch (c) {
            case 0x20AC, 0x201A, 0x0192, 0x201E, 0x2026, 0x2020, 0x2021, 0x02C6, 0x2030, 0x0160, 0x2039, 0x0152, 0x017D,
                 0x2018, 0x2019, 0x201C, 0x201D, 0x2022, 0x2013, 0x2014, 0x02DC, 0x2122, 0x0161, 0x203A, 0x0153, 0x017E,
                 0x0178 -> true;
            default -> false;
        };
    }

    /** Writes the page footers and saves the document atomically. */
    public void save(Path file, java.time.Instant created) {
        try {
            if (cs != null) cs.close();
            cs = null;
            if (created != null) {
                Calendar cal = new GregorianCalendar(TimeZone.getTimeZone("UTC"));
                cal.setTimeInMillis(created.toEpochMilli());
                doc.getDocumentInformation().setCreationDate(cal);
            }
            int n = doc.getNumberOfPages();
            for (int i = 0; i < n; i++) {
                try (PDPageContentStream f = new PDPageContentStream(doc, doc.getPage(i), PDPageContentStream.AppendMode.APPEND, true, true)) {
                    String page = "Page " + (i + 1) + " of " + n;
                    float pw = textWidth(regular, 8, page);
                    String left = fit(footer, regular, 8, width() - pw - 20);
                    for (int k = 0; k < 2; k++) {
                        f.beginText();
                        f.setFont(regular, 8);
                        f.setNonStrokingColor(GREY);
                        f.newLineAtOffset(k == 0 ? MARGIN : SIZE.getWidth() - MARGIN - pw, MARGIN - 14);
                        f.showText(safe(k == 0 ? left : page));
                        f.endText();
                    }
                }
            }
            AtomicFiles.write(file, doc::save);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    @Override
    public void close() {
        try {
            if (cs != null) cs.close();
            doc.close();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}

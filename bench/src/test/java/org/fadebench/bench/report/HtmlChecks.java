package org.fadebench.bench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringReader;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import javax.xml.parsers.DocumentBuilderFactory;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Attribute;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.jsoup.parser.ParseError;
import org.jsoup.parser.Parser;
import org.xml.sax.InputSource;

/**
 * Checks of a report page, as a browser's parser reads it (jsoup, whose parser follows the WHATWG
 * HTML parsing algorithm) and as an XML parser reads its plots (the JDK's).
 */
public final class HtmlChecks {

    /** Attributes through which an element loads or links to another resource. */
    private static final List<String> REFERENCES = List.of("src", "href", "xlink:href", "srcset", "action",
            "formaction", "poster", "data", "background", "cite", "manifest", "ping");

    /** Elements that run code or embed or load another resource. */
    private static final String LOADERS = "script, link, img, iframe, frame, object, embed, audio, video, source, "
            + "track, base, form, image, use, foreignObject, meta[http-equiv]";

    private HtmlChecks() {
    }

    /**
     * Parses the page and checks it: an HTML5 doctype, no parse errors, every {@code <svg>} well-formed
     * XML on its own, nothing that runs code or reaches for another file, font or the network (no
     * loading elements, no reference attributes other than a fragment {@code #id}, no {@code url(}
     * but to a fragment, no {@code @import} in CSS or attributes, every id once, every {@code url(#id)}
     * of a plot to an element of that plot, no event-handler attributes). Returns the document.
     */
    public static Document selfContained(String html) throws Exception {
        assertTrue(html.startsWith("<!DOCTYPE html>"), "HTML5 doctype");
        Parser parser = Parser.htmlParser().setTrackErrors(100);
        Document doc = Jsoup.parse(html, "", parser);
        List<String> errors = new ArrayList<>();
        for (ParseError e : parser.getErrors()) {
            errors.add(e.toString());
        }
        assertEquals(List.of(), errors, "HTML parse errors");
        assertEquals("utf-8", doc.select("meta[charset]").attr("charset").toLowerCase(Locale.ROOT));

        List<String> svgs = svgElements(html);
        assertEquals(doc.select("svg").size(), svgs.size(), "every <svg> found by both parsers");
        for (String svg : svgs) {
            wellFormedXml(svg);
        }
        assertTrue(doc.select(LOADERS).isEmpty(), "loading elements: " + doc.select(LOADERS));
        for (Element e : doc.getAllElements()) {
            for (Attribute a : e.attributes()) {
                String key = a.getKey().toLowerCase(Locale.ROOT);
                String value = a.getValue().strip();
                assertFalse(key.startsWith("on"), "event handler " + key + " on <" + e.tagName() + ">");
                if (REFERENCES.contains(key)) {
                    assertTrue(value.startsWith("#"), "<" + e.tagName() + " " + key + "=\"" + value + "\"> refers "
                            + "to another resource");
                }
                noCssLoads(value);
            }
        }
        for (Element style : doc.select("style")) {
            noCssLoads(style.data());
        }
        Set<String> ids = new HashSet<>();
        for (Element e : doc.select("[id]")) {
            assertTrue(ids.add(e.id()), "id '" + e.id() + "' twice in the page");
        }
        for (Element svg : doc.select("svg")) {
            Set<String> own = new HashSet<>(svg.select("[id]").eachAttr("id"));
            Matcher refs = Pattern.compile("url\\(#([^)]+)\\)").matcher(svg.outerHtml());
            while (refs.find()) {
                assertTrue(own.contains(refs.group(1)), "url(#" + refs.group(1) + ") refers outside its <svg>");
            }
        }
        return doc;
    }

    /** The text of each {@code <svg>…</svg>} element of the page, as written. */
    public static List<String> svgElements(String html) {
        List<String> found = new ArrayList<>();
        Matcher m = Pattern.compile("<svg[\\s>].*?</svg>", Pattern.DOTALL).matcher(html);
        while (m.find()) {
            found.add(m.group());
        }
        return found;
    }

    /** Parses {@code svg} with the JDK's XML parser (namespace aware, no DTD fetched): fails if not well-formed. */
    public static org.w3c.dom.Document wellFormedXml(String svg) throws Exception {
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setNamespaceAware(true);
        f.setFeature("http://apache.org/xml/features/nonvalidating/load-external-dtd", false);
        org.w3c.dom.Document doc = f.newDocumentBuilder().parse(new InputSource(new StringReader(svg)));
        assertEquals("svg", doc.getDocumentElement().getLocalName());
        assertEquals("http://www.w3.org/2000/svg", doc.getDocumentElement().getNamespaceURI());
        return doc;
    }

    /** No {@code url(…)} but to a fragment of the page ({@code url(#id)}), no {@code @import} or {@code @font-face}. */
    private static void noCssLoads(String css) {
        String c = css.toLowerCase(Locale.ROOT).replaceAll("\\s+", "");
        assertFalse(c.replaceAll("url\\(['\"]?#", "").contains("url(") || c.contains("@import")
                || c.contains("@font-face"), "CSS loads: " + css);
    }
}

package dev.tare.testing;

import java.io.IOException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import javax.xml.parsers.DocumentBuilderFactory;
import javax.xml.parsers.ParserConfigurationException;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;
import org.xml.sax.SAXException;

/**
 * The closing line of {@code mvn verify}: the unit and end-to-end tests' reports summed, every
 * skipped test named with its reason. Maven runs it after the end-to-end tests (see the POM), so
 * the test command ends with one line a person can read; it exits 1 when no test ran.
 */
public final class TestSummary {
    /** A skip reason is cut to this length: one line, not a paragraph. */
    private static final int REASON_CHARS = 120;

    private int tests;
    private int failed;
    private final List<String> skipped = new ArrayList<>();

    private TestSummary() {
    }

    /** {@code args[0]}: the build folder holding {@code surefire-reports} and {@code failsafe-reports}. */
    public static void main(String[] args) throws Exception {
        TestSummary summary = of(Path.of(args.length > 0 ? args[0] : "target"));
        System.out.println(summary.line());
        if (summary.tests == 0) {
            System.exit(1);
        }
    }

    /** The reports under the build folder {@code target}, summed. */
    static TestSummary of(Path target) throws IOException, ParserConfigurationException, SAXException {
        TestSummary summary = new TestSummary();
        for (String folder : List.of("surefire-reports", "failsafe-reports")) {
            summary.read(target.resolve(folder));
        }
        return summary;
    }

    private void read(Path folder) throws IOException, ParserConfigurationException, SAXException {
        if (!Files.isDirectory(folder)) {
            return;
        }
        DocumentBuilderFactory factory = DocumentBuilderFactory.newInstance();
        factory.setFeature("http://apache.org/xml/features/disallow-doctype-decl", true);
        try (DirectoryStream<Path> reports = Files.newDirectoryStream(folder, "TEST-*.xml")) {
            for (Path report : reports) {
                Document document = factory.newDocumentBuilder().parse(report.toFile());
                NodeList cases = document.getElementsByTagName("testcase");
                for (int i = 0; i < cases.getLength(); i++) {
                    Element test = (Element) cases.item(i);
                    tests++;
                    if (test.getElementsByTagName("failure").getLength() > 0
                            || test.getElementsByTagName("error").getLength() > 0) {
                        failed++;
                    } else if (test.getElementsByTagName("skipped").getLength() > 0) {
                        Element skip = (Element) test.getElementsByTagName("skipped").item(0);
                        skipped.add(simpleName(test.getAttribute("classname")) + "." + test.getAttribute("name")
                                + ": " + reason(skip.getAttribute("message").isBlank() ? skip.getTextContent()
                                : skip.getAttribute("message")));
                    }
                }
            }
        }
    }

    String line() {
        String line = "tests: " + (tests - failed - skipped.size()) + " passed, " + failed + " failed, " + skipped.size()
                + " skipped";
        return skipped.isEmpty() ? line : line + " (" + String.join("; ", skipped) + ")";
    }

    private static String simpleName(String className) {
        return className.substring(className.lastIndexOf('.') + 1);
    }

    private static String reason(String message) {
        String first = message.lines().findFirst().orElse("no reason given").strip();
        first = first.replaceFirst("^(\\S+Exception: )?Assumption failed: ", "").replaceFirst("^skipped: ", "");
        return first.length() > REASON_CHARS ? first.substring(0, REASON_CHARS - 3) + "..." : first;
    }
}

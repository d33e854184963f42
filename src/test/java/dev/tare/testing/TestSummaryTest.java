package dev.tare.testing;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The test command's closing line, from report files in the form the test runners write. */
class TestSummaryTest {
    @Test
    void sumsBothRunnersAndNamesEachSkipWithItsReason(@TempDir Path target) throws Exception {
        Files.createDirectories(target.resolve("surefire-reports"));
        Files.createDirectories(target.resolve("failsafe-reports"));
        Files.writeString(target.resolve("surefire-reports/TEST-dev.tare.ATest.xml"), """
                <?xml version="1.0" encoding="UTF-8"?>
                <testsuite name="dev.tare.ATest" tests="3" failures="1" errors="0" skipped="0">
                  <testcase name="one" classname="dev.tare.ATest"/>
                  <testcase name="two" classname="dev.tare.ATest"><failure message="no"/></testcase>
                  <testcase name="three" classname="dev.tare.ATest"/>
                </testsuite>
                """);
        Files.writeString(target.resolve("failsafe-reports/TEST-dev.tare.BIT.xml"), """
                <?xml version="1.0" encoding="UTF-8"?>
                <testsuite name="dev.tare.BIT" tests="3" failures="0" errors="0" skipped="2">
                  <testcase name="browser" classname="dev.tare.report.BIT">
                    <skipped message="Assumption failed: skipped: /usr/bin/chromium is not installed&#10;more"/>
                  </testcase>
                  <testcase name="launcher" classname="dev.tare.BIT"/>
                  <testcase name="gofmt" classname="dev.tare.BIT"><skipped>org.opentest4j.TestAbortedException: Assumption failed: skipped: gofmt is not installed</skipped></testcase>
                </testsuite>
                """);
        Files.writeString(target.resolve("failsafe-reports/failsafe-summary.xml"), "<failsafe-summary/>");
        assertEquals("tests: 3 passed, 1 failed, 2 skipped (BIT.browser: /usr/bin/chromium is not installed;"
                        + " BIT.gofmt: gofmt is not installed)",
                TestSummary.of(target).line());
    }
}

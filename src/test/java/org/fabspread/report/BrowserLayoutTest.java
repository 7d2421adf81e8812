package org.fabspread.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.File;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

import org.fabspread.cli.Main;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The demo report as a browser lays it out: the command a user runs writes report.html, Debian's
 * chromium (headless) loads it in a frame 1400 px and 420 px wide, and the page must not be wider than
 * the frame (wide tables scroll inside their own box instead). A small probe page beside the report
 * reads the frame's {@code document.documentElement.scrollWidth} and {@code innerWidth} into its title,
 * which {@code --dump-dom} prints.
 *
 * <p>Without chromium on PATH the test is skipped on a developer machine; with
 * {@code FABSPREAD_REQUIRE_BROWSER} set (as .ci/run sets it) a missing browser fails the test.
 */
class BrowserLayoutTest {

    private static final Pattern TITLE = Pattern.compile("<title>W=(\\d+) I=(\\d+)</title>");

    @TempDir
    static Path dir;

    private static Path chromium;
    private static Path report;

    @BeforeAll
    static void writeDemoReport() {
        chromium = findChromium();
        if (chromium == null && System.getenv("FABSPREAD_REQUIRE_BROWSER") != null) {
            fail("chromium is not on PATH but FABSPREAD_REQUIRE_BROWSER is set (apt-get install -y chromium)");
        }
        Assumptions.assumeTrue(chromium != null, "chromium is not installed; the browser layout check is skipped");
        Path out = dir.resolve("demo");
        StringWriter err = new StringWriter();
        int code = Main.run(new String[] {"run", "demo-studies/pilot-line-inverted.yaml", "--out", out.toString(),
                "--samples", "256", "--threads", "2"}, new PrintWriter(Writer.nullWriter()), new PrintWriter(err));
        assertEquals(0, code, err.toString());
        report = out.resolve(ReportWriter.HTML_FILE);
        assertTrue(Files.isRegularFile(report));
    }

    @Test
    void noPageOverflowAtDesktopWidth() throws Exception {
        // common practice: a page is laid out for its viewport when nothing is wider than it
        int[] w = measure(1400);
        assertEquals(1400, w[1]);
        assertTrue(w[0] <= w[1], "the page is " + w[0] + " px wide in a " + w[1] + " px frame");
    }

    @Test
    void noPageOverflowAtPhoneWidth() throws Exception {
        int[] w = measure(420);
        assertEquals(420, w[1]);
        assertTrue(w[0] <= w[1], "the page is " + w[0] + " px wide in a " + w[1] + " px frame");
    }

    /** {scrollWidth, innerWidth} of the report in a frame {@code width} px wide. */
    private static int[] measure(int width) throws IOException, InterruptedException {
        Path probe = report.resolveSibling("probe-" + width + ".html");
        Files.writeString(probe, "<!DOCTYPE html><html><head><title>pending</title></head><body style=\"margin:0\">"
                + "<iframe src=\"" + report.getFileName() + "\" style=\"border:0;width:" + width + "px;height:900px\" "
                + "onload=\"var d=this.contentDocument;document.title='W='+d.documentElement.scrollWidth+' I='"
                + "+this.contentWindow.innerWidth;\"></iframe></body></html>", StandardCharsets.UTF_8);
        Path profile = Files.createTempDirectory(dir, "chromium-profile");
        List<String> cmd = List.of(chromium.toString(), "--headless", "--no-sandbox", "--disable-gpu",
                "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update",
                "--disable-sync", "--allow-file-access-from-files", "--user-data-dir=" + profile,
                "--window-size=1600,1000", "--dump-dom", probe.toUri().toString());
        Path dom = dir.resolve("dom-" + width + ".html");
        Process p = new ProcessBuilder(cmd).redirectOutput(dom.toFile()).redirectError(ProcessBuilder.Redirect.DISCARD)
                .start();
        try {
            if (!p.waitFor(120, TimeUnit.SECONDS)) {
                fail("chromium did not finish within 120 s");
            }
        } finally {
            p.destroyForcibly();
            deleteTree(profile);
        }
        Matcher m = TITLE.matcher(Files.readString(dom, StandardCharsets.UTF_8));
        assertTrue(m.find(), "the probe page did not report the frame's widths");
        return new int[] {Integer.parseInt(m.group(1)), Integer.parseInt(m.group(2))};
    }

    private static Path findChromium() {
        String path = System.getenv("PATH");
        if (path == null) {
            return null;
        }
        for (String d : path.split(File.pathSeparator)) {
            for (String name : List.of("chromium", "chromium-browser")) {
                Path c = Path.of(d, name);
                if (Files.isExecutable(c)) {
                    return c;
                }
            }
        }
        return null;
    }

    private static void deleteTree(Path root) throws IOException {
        if (!Files.exists(root)) {
            return;
        }
        List<Path> all = new ArrayList<>();
        try (Stream<Path> s = Files.walk(root)) {
            s.sorted(Comparator.reverseOrder()).forEach(all::add);
        }
        for (Path x : all) {
            Files.deleteIfExists(x);
        }
    }
}

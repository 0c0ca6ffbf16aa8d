package org.twinlight.analysis;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;

/**
 * report.html opened in headless Chromium (the Debian package {@code chromium}; {@code .ci/run}
 * installs it): every image loads, no script error or console error, nothing is fetched from the
 * network, and a screenshot is saved to {@code target/report-screenshot.png} to look at. Skipped, with
 * a message saying so, only where Chromium is not installed.
 */
class ReportBrowserTest {
    /** Recorded into the page by the check script once the page has loaded. */
    private static final String CHECK = """
            <script>
            window.__errors = [];
            window.addEventListener('error', e => window.__errors.push('error: ' + (e.message || e.target.src)), true);
            const original = console.error;
            console.error = (...a) => { window.__errors.push('console: ' + a.join(' ')); original(...a); };
            window.addEventListener('load', () => {
              const imgs = Array.from(document.images);
              const bad = imgs.filter(i => !(i.complete && i.naturalWidth > 0)).map(i => i.alt);
              const div = document.createElement('div');
              div.id = 'browser-check';
              div.textContent = 'images=' + imgs.length + ';broken=' + bad.length + ';errors=' + window.__errors.length
                  + ';details=' + JSON.stringify(bad.concat(window.__errors));
              document.body.appendChild(div);
            });
            </script>
            """;

    @Test
    void reportOpensInABrowserWithEveryImageAndNoErrors() throws Exception {
        String chromium = chromium();
        Assumptions.assumeTrue(chromium != null, "Chromium is not installed, so report.html was not opened in a "
                + "browser; install it with: apt-get install -y --no-install-recommends chromium (.ci/run does)");
        AnalysedCurves.Outcome run = AnalysedCurves.space(1);
        Path report = run.outputDir().resolve("report.html");
        String html = Files.readString(report);
        assertThat(html).as("nothing fetched from the network").doesNotContainPattern("(src|href)=\"https?:")
                .doesNotContain("url(http").doesNotContain("@import");
        Path checked = run.outputDir().resolve("report-check.html");
        Files.writeString(checked, html.replaceFirst("<head>", "<head>\n" + Matcher.quoteReplacement(CHECK)));

        Process dom = browse(chromium, "--dump-dom", checked);
        String out = new String(dom.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        String err = new String(dom.getErrorStream().readAllBytes(), StandardCharsets.UTF_8);
        assertThat(dom.waitFor(120, TimeUnit.SECONDS)).isTrue();
        Matcher m = Pattern.compile("images=(\\d+);broken=(\\d+);errors=(\\d+);details=([^<]*)").matcher(out);
        assertThat(m.find()).as("the check ran in the page; browser said: " + err).isTrue();
        assertThat(Integer.parseInt(m.group(1))).as("images in the report").isGreaterThanOrEqualTo(3);
        assertThat(Integer.parseInt(m.group(2))).as("images not loaded: " + m.group(4)).isZero();
        assertThat(Integer.parseInt(m.group(3))).as("errors in the page: " + m.group(4)).isZero();
        assertThat(err).as("console").doesNotContain("Uncaught").doesNotContainPattern("CONSOLE.*ERROR");

        Path shot = Path.of("target", "report-screenshot.png").toAbsolutePath();
        Files.deleteIfExists(shot);
        Process p = browse(chromium, "--screenshot=" + shot, report);
        p.getInputStream().readAllBytes();
        p.getErrorStream().readAllBytes();
        assertThat(p.waitFor(120, TimeUnit.SECONDS)).isTrue();
        assertThat(shot).exists();
        assertThat(Files.size(shot)).isGreaterThan(20_000);
    }

    private static Process browse(String chromium, String action, Path page) throws IOException {
        Path profile = Path.of("target", "chromium-profile").toAbsolutePath();
        List<String> cmd = new ArrayList<>(List.of(chromium, "--headless", "--no-sandbox", "--disable-gpu",
                "--disable-background-networking", "--disable-extensions", "--disable-sync", "--no-first-run",
                "--disable-dev-shm-usage", "--hide-scrollbars", "--user-data-dir=" + profile,
                "--window-size=1200,3000", "--virtual-time-budget=10000", "--enable-logging=stderr", "--v=0",
                action, page.toUri().toString()));
        return new ProcessBuilder(cmd).start();
    }

    /** The Chromium command on the PATH, or null. */
    static String chromium() {
        for (String name : List.of("chromium", "chromium-browser")) {
            for (String dir : System.getenv().getOrDefault("PATH", "").split(java.io.File.pathSeparator)) {
                if (!dir.isEmpty() && Files.isExecutable(Path.of(dir, name))) {
                    return Path.of(dir, name).toString();
                }
            }
        }
        return null;
    }
}

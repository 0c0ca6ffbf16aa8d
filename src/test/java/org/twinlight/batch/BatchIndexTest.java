package org.twinlight.batch;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.StringReader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** summary.csv and index.html: every target's text kept verbatim in the table and escaped on the page. */
class BatchIndexTest {
    @TempDir
    Path dir;

    private static final String HOSTILE = "<script>alert(\"x\")</script> & <img src=x onerror='y'>, \"quoted\"";

    @Test
    void aHostileLabelAndMessageAreEscapedOnThePageAndKeptVerbatimInTheTable() throws Exception {
        Path f = Files.writeString(dir.resolve("a.csv"), "x");
        BatchTarget t = new BatchTarget("a", HOSTILE, List.of(f), null, null, null, List.of(), null, dir.resolve("a"), "test");
        BatchTarget u = new BatchTarget("b", "plain", List.of(f), null, null, null, List.of(), null, dir.resolve("b"), "test");
        TargetResult ok = new TargetResult(0, "fine </td><b>bold</b>",
                Map.of("radius1", new TargetResult.KeyValue(0.10512, 0.00031)), List.of("fit.png"), "fit.png");
        BatchIndex.write(dir, List.of(t, u), List.of(new BatchJournal.Entry("a", t.fingerprint(), ok, 1.0),
                new BatchJournal.Entry("b", u.fingerprint(), TargetResult.failed(2, "error: " + HOSTILE), 0.1)));

        String html = Files.readString(dir.resolve(BatchIndex.INDEX));
        assertThat(html).doesNotContain("<script").doesNotContain("<img src=x").doesNotContain("<b>bold")
                .doesNotContain("onerror='");
        assertThat(html).contains("&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; &lt;img src=x "
                + "onerror=&#39;y&#39;&gt;");
        assertThat(html).contains("0.10512 ± 0.00031").contains("1 ok").contains("1 failed").contains("failed (exit 2)");
        // nothing is fetched: no scheme in any link or source
        assertThat(html).doesNotContainPattern("(src|href)=\"[a-z]+:");

        String csv = Files.readString(dir.resolve(BatchIndex.SUMMARY));
        List<CSVRecord> rows = CSVFormat.DEFAULT.builder().setCommentMarker('#').setHeader().setSkipHeaderRecord(true)
                .get().parse(new StringReader(csv)).getRecords();
        assertThat(rows).hasSize(2);
        assertThat(rows.get(0).get("target")).isEqualTo(HOSTILE);
        assertThat(rows.get(0).get("status")).isEqualTo("ok");
        assertThat(rows.get(0).get("radius1")).isEqualTo("0.10512");
        assertThat(rows.get(0).get("radius1_uncertainty")).isEqualTo("3.1E-4");
        assertThat(rows.get(1).get("status")).isEqualTo("failed");
        assertThat(rows.get(1).get("exit_code")).isEqualTo("2");
        assertThat(rows.get(1).get("message")).isEqualTo("error: " + HOSTILE);
        assertThat(rows.get(1).get("output")).isEqualTo("b");
        assertThat(rows.get(1).get("radius1")).isEmpty();
    }

    @Test
    void valuesAreRoundedToTheirUncertainty() {
        assertThat(BatchIndex.valueWithUncertainty(new TargetResult.KeyValue(1.4700014146905098, 4.41e-6)))
                .isEqualTo("1.4700014 ± 0.0000044");
        assertThat(BatchIndex.valueWithUncertainty(new TargetResult.KeyValue(88.515392, 0.0125)))
                .isEqualTo("88.515 ± 0.013");
        assertThat(BatchIndex.valueWithUncertainty(new TargetResult.KeyValue(1234.5, 56))).isEqualTo("1235 ± 56");
        assertThat(BatchIndex.valueWithUncertainty(new TargetResult.KeyValue(0.99831, Double.NaN)))
                .isEqualTo("0.9983100");
    }
}

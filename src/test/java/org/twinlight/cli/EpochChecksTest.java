package org.twinlight.cli;

import static org.assertj.core.api.Assertions.assertThatCode;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;
import org.twinlight.BadInputException;

class EpochChecksTest {

    private static final double[] FULL_JD = {2460300.0, 2460301.5, 2460303.0};

    /** A catalogue epoch from about 1910 (JD 2418700, 41 600 d and 16 600 cycles before) is accepted. */
    @Test
    void oldCatalogueEpochIsAccepted() {
        assertThatCode(() -> EpochChecks.near(2418700.123, 2.5, FULL_JD, "sim.csv", "option --epoch"))
                .doesNotThrowAnyException();
    }

    /** Times in the form BJD − 2457000 with a full epoch: the times are named as the offset ones. */
    @Test
    void offsetTimesWithAFullEpochSuggestTheTimeOffset() {
        double[] offsetTimes = {3300.0, 3301.5, 3303.0};
        assertThatThrownBy(() -> EpochChecks.near(2460300.25, 2.5, offsetTimes, "tess.csv", "option --epoch"))
                .isInstanceOf(BadInputException.class)
                .hasMessageContaining("tess.csv").hasMessageContaining("--time-offset 2457000")
                .hasMessageContaining("3300.25");
    }

    /** An epoch within 1e5 d but 4e6 cycles of a 0.01-d period away is refused with the cycle count. */
    @Test
    void tooManyCyclesAreRefused() {
        assertThatThrownBy(() -> EpochChecks.near(2420300.0, 0.01, FULL_JD, "sim.csv", "option --epoch"))
                .isInstanceOf(BadInputException.class).hasMessageContaining("4.00e+06 cycles");
    }
}

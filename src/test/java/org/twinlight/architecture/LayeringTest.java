package org.twinlight.architecture;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;
import static com.tngtech.archunit.library.dependencies.SlicesRuleDefinition.slices;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The layering of STYLE/DEVELOPERS.md held by test: the library core (photometry, time, orbit,
 * eclipse, fit, timing, dimensions, velocity, sky, planning) knows nothing of the command line, plots or the report layer;
 * the batch layer sits beside the command line (it may use report, not cli); arrows point inwards only; no package
 * cycles.
 */
class LayeringTest {
    private static final String[] CORE = {"org.twinlight.photometry..", "org.twinlight.time..", "org.twinlight.orbit..",
        "org.twinlight.eclipse..", "org.twinlight.fit..", "org.twinlight.timing..", "org.twinlight.dimensions..",
        "org.twinlight.velocity..", "org.twinlight.sky..", "org.twinlight.planning..",
        "org.twinlight.statistics..", "org.twinlight.sampling.."};

    private static JavaClasses classes;

    @BeforeAll
    static void importClasses() {
        classes = new ClassFileImporter().withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
                .importPackages("org.twinlight");
        // an empty import would make every rule below pass vacuously
        org.assertj.core.api.Assertions.assertThat(classes.size()).isGreaterThan(50);
    }

    @Test
    void coreDoesNotUseCommandLineOrPlots() {
        noClasses().that().resideInAnyPackage(CORE)
                .should().dependOnClassesThat().resideInAnyPackage("picocli..", "org.knowm.xchart..", "java.awt..",
                        "javax.imageio..", "org.twinlight.cli..", "org.twinlight.report..", "org.twinlight.analysis..")
                .check(classes);
    }

    @Test
    void analysisIsAnOuterLayerBelowTheCommandLine() {
        // analysis wires the library and report together; the command line calls it, never the reverse
        noClasses().that().resideInAPackage("org.twinlight.analysis..")
                .should().dependOnClassesThat().resideInAnyPackage("picocli..", "org.twinlight.cli..")
                .check(classes);
        noClasses().that().resideInAPackage("org.twinlight.report..")
                .should().dependOnClassesThat().resideInAPackage("org.twinlight.analysis..")
                .check(classes);
        noClasses().that().resideInAPackage("org.twinlight.analysis..")
                .should().accessField(System.class, "out").orShould().accessField(System.class, "err")
                .orShould().callMethod(System.class, "exit", int.class)
                .check(classes);
    }

    @Test
    void coreDoesNotPrintToTheTerminal() {
        noClasses().that().resideInAnyPackage(CORE)
                .should().accessField(System.class, "out").orShould().accessField(System.class, "err")
                .check(classes);
    }

    @Test
    void photometryReadersDoNotUseJson() {
        noClasses().that().resideInAPackage("org.twinlight.photometry..")
                .should().dependOnClassesThat().resideInAPackage("com.fasterxml.jackson..")
                .check(classes);
    }

    @Test
    void modelAndFitPackagesHoldNoFileFormats() {
        noClasses().that().resideInAnyPackage("org.twinlight.eclipse..", "org.twinlight.fit..",
                "org.twinlight.timing..")
                .should().dependOnClassesThat().resideInAnyPackage("com.fasterxml.jackson..", "java.nio.file..")
                .check(classes);
    }

    @Test
    void reportDoesNotUseCommandLine() {
        noClasses().that().resideInAPackage("org.twinlight.report..")
                .should().dependOnClassesThat().resideInAnyPackage("picocli..", "org.twinlight.cli..")
                .check(classes);
    }

    @Test
    void batchDoesNotUseCommandLine() {
        // the batch's unit of work runs unchanged on a cluster engine: no picocli, no terminal options
        noClasses().that().resideInAPackage("org.twinlight.batch..")
                .should().dependOnClassesThat().resideInAnyPackage("picocli..", "org.twinlight.cli..")
                .check(classes);
        noClasses().that().resideInAnyPackage(CORE).or().resideInAPackage("org.twinlight.report..")
                .should().dependOnClassesThat().resideInAPackage("org.twinlight.batch..")
                .check(classes);
    }

    @Test
    void timeAndOrbitAreIndependent() {
        noClasses().that().resideInAnyPackage("org.twinlight.time..", "org.twinlight.orbit..")
                .should().dependOnClassesThat().resideInAnyPackage("org.twinlight.photometry..", "org.twinlight.eclipse..",
                        "org.twinlight.fit..", "org.twinlight.timing..", "org.twinlight.dimensions..",
                        "org.twinlight.velocity..", "org.twinlight.sky..", "org.twinlight.planning..")
                .check(classes);
    }

    @Test
    void dimensionsAndVelocitiesStandApartFromTheLightCurveModelAndFit() {
        // dimensions take numbers (elements, covariance), not fit results or files; velocities know the
        // orbit, not the eclipse model or the fit, so the fit can later take them as one more data set
        noClasses().that().resideInAPackage("org.twinlight.dimensions..")
                .should().dependOnClassesThat().resideInAnyPackage("org.twinlight.eclipse..", "org.twinlight.fit..",
                        "org.twinlight.timing..", "org.twinlight.photometry..", "org.twinlight.velocity..",
                        "com.fasterxml.jackson..", "java.nio.file..")
                .check(classes);
        noClasses().that().resideInAPackage("org.twinlight.velocity..")
                .should().dependOnClassesThat().resideInAnyPackage("org.twinlight.eclipse..", "org.twinlight.fit..",
                        "org.twinlight.timing..", "org.twinlight.dimensions..", "com.fasterxml.jackson..")
                .check(classes);
    }

    @Test
    void eclipseModelDoesNotKnowTheFit() {
        noClasses().that().resideInAnyPackage("org.twinlight.eclipse..", "org.twinlight.orbit..")
                .should().dependOnClassesThat().resideInAnyPackage("org.twinlight.fit..", "org.twinlight.timing..")
                .check(classes);
    }

    @Test
    void periodSearchAndMinimaAreApart() {
        noClasses().that().resideInAPackage("org.twinlight.timing.period..")
                .should().dependOnClassesThat().resideInAPackage("org.twinlight.timing.minima..")
                .check(classes);
        noClasses().that().resideInAPackage("org.twinlight.timing.minima..")
                .should().dependOnClassesThat().resideInAPackage("org.twinlight.timing.period..")
                .check(classes);
    }

    @Test
    void skyUsesOnlyTime() {
        noClasses().that().resideInAPackage("org.twinlight.sky..")
                .should().dependOnClassesThat().resideInAnyPackage("org.twinlight.photometry..", "org.twinlight.orbit..",
                        "org.twinlight.eclipse..", "org.twinlight.fit..", "org.twinlight.timing..",
                        "org.twinlight.dimensions..", "org.twinlight.planning..", "java.nio.file..")
                .check(classes);
    }

    @Test
    void planningReadsNoFilesAndKnowsNoFit() {
        noClasses().that().resideInAPackage("org.twinlight.planning..")
                .should().dependOnClassesThat().resideInAnyPackage("org.twinlight.photometry..", "org.twinlight.fit..",
                        "java.nio.file..", "com.fasterxml.jackson..", "org.apache.commons.csv..")
                .check(classes);
    }

    @Test
    void statisticsAndSamplingDependOnNoOtherTwinlightPackage() {
        // statistics: the covariance and error-scaling rule shared by the light-curve, O−C and velocity
        // fits; sampling: the sampler sees a density as a function of a vector, the fit adapts itself to it
        noClasses().that().resideInAnyPackage("org.twinlight.statistics..", "org.twinlight.sampling..")
                .should().dependOnClassesThat().resideInAnyPackage("org.twinlight.photometry..", "org.twinlight.time..",
                        "org.twinlight.orbit..", "org.twinlight.eclipse..", "org.twinlight.fit..",
                        "org.twinlight.timing..", "org.twinlight.dimensions..", "org.twinlight.velocity..",
                        "org.twinlight.sky..", "org.twinlight.planning..", "com.fasterxml.jackson..", "java.nio.file..")
                .check(classes);
        noClasses().that().resideInAPackage("org.twinlight.statistics..")
                .should().dependOnClassesThat().resideInAPackage("org.twinlight.sampling..").check(classes);
        noClasses().that().resideInAPackage("org.twinlight.sampling..")
                .should().dependOnClassesThat().resideInAPackage("org.twinlight.statistics..").check(classes);
    }

    @Test
    void noPackageCycles() {
        slices().matching("org.twinlight.(*)..").should().beFreeOfCycles().check(classes);
    }
}

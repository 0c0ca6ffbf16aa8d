package org.twinlight.photometry;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import org.junit.jupiter.api.Test;

/** The photometry package is library core: no commands, plots, reports or terminal. */
class PhotometryLayeringTest {

    @Test
    void photometryKnowsNothingOfCommandsOrPlots() {
        JavaClasses classes = new ClassFileImporter().withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
                .importPackages("org.twinlight.photometry");
        noClasses().that().resideInAPackage("org.twinlight.photometry")
                .should().dependOnClassesThat().resideInAnyPackage("org.twinlight.cli..", "org.twinlight.report..",
                        "picocli..", "org.knowm.xchart..", "com.fasterxml.jackson..")
                .check(classes);
        noClasses().that().resideInAPackage("org.twinlight.photometry")
                .should().accessField(System.class, "out").orShould().accessField(System.class, "err")
                .check(classes);
    }
}

package org.pointcall.ui;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import com.tngtech.archunit.lang.ArchRule;

/**
 * The module layering of DEVELOPERS.md, checked on the compiled classes of every module (this module sees them
 * all on its test classpath): shared &lt;- ingest &lt;- models &lt;- replay &lt;- monitor-ui.
 */
class LayeringTest {
    private static JavaClasses classes;

    @BeforeAll
    static void importClasses() {
        classes = new ClassFileImporter()
                .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
                .importPackages("org.pointcall");
    }

    private static void check(ArchRule rule) {
        rule.allowEmptyShould(true).check(classes);
    }

    @Test
    void sharedDependsOnNoOtherModule() {
        check(noClasses().that().resideInAPackage("org.pointcall.shared..")
                .should().dependOnClassesThat().resideInAnyPackage(
                        "org.pointcall.ingest..", "org.pointcall.models..", "org.pointcall.replay..",
                        "org.pointcall.ui.."));
    }

    @Test
    void ingestDependsOnlyOnShared() {
        check(noClasses().that().resideInAPackage("org.pointcall.ingest..")
                .should().dependOnClassesThat().resideInAnyPackage(
                        "org.pointcall.models..", "org.pointcall.replay..", "org.pointcall.ui.."));
    }

    @Test
    void modelsDoNotReachUp() {
        check(noClasses().that().resideInAPackage("org.pointcall.models..")
                .should().dependOnClassesThat().resideInAnyPackage("org.pointcall.replay..", "org.pointcall.ui.."));
    }

    @Test
    void replayDoesNotReachTheConsole() {
        check(noClasses().that().resideInAPackage("org.pointcall.replay..")
                .should().dependOnClassesThat().resideInAnyPackage("org.pointcall.ui.."));
    }

    @Test
    void onlyTheConsoleImportsJavaFx() {
        check(noClasses().that().resideOutsideOfPackage("org.pointcall.ui..")
                .should().dependOnClassesThat().resideInAnyPackage("javafx..", "io.fair_acc.."));
    }

    @Test
    void sharedAndIngestStayFreeOfSmileAndSockets() {
        check(noClasses().that().resideInAnyPackage("org.pointcall.shared..", "org.pointcall.ingest..")
                .should().dependOnClassesThat().resideInAnyPackage("smile.."));
        check(noClasses().that().resideInAPackage("org.pointcall.shared..")
                .should().dependOnClassesThat().resideInAnyPackage("java.net..", "java.nio.channels.."));
    }

    @Test
    void noUtilGrabBagPackages() {
        check(noClasses().should().resideInAPackage("org.pointcall..util.."));
    }

    /** The console's packages (console, desk, demo, share, trace, settings, cli) depend on each other one way. */
    @Test
    void consolePackagesHaveNoCycles() {
        check(com.tngtech.archunit.library.dependencies.SlicesRuleDefinition.slices()
                .matching("org.pointcall.ui.(*)..").should().beFreeOfCycles());
    }
}

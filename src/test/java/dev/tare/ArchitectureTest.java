package dev.tare;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;
import static com.tngtech.archunit.library.Architectures.layeredArchitecture;
import static com.tngtech.archunit.library.dependencies.SlicesRuleDefinition.slices;
import static org.junit.jupiter.api.Assertions.assertEquals;

import com.tngtech.archunit.core.domain.JavaClass;
import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import java.io.FileInputStream;
import java.io.FileOutputStream;
import java.io.FileReader;
import java.io.FileWriter;
import java.io.RandomAccessFile;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Collectors;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The shape of the code in the design ("Shape of the code"): dependencies point down the layer
 * table only, no two packages depend on each other, the engines read and write no files, and every
 * class has a name of its own.
 */
class ArchitectureTest {
    private static JavaClasses main;

    @BeforeAll
    static void importMainClasses() {
        main = new ClassFileImporter().withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
                .importPackages("dev.tare");
    }

    @Test
    void dependenciesPointDownTheLayerTable() {
        layeredArchitecture().consideringOnlyDependenciesInLayers()
                .layer("cli").definedBy("dev.tare.cli..")
                .layer("report").definedBy("dev.tare.report..")
                .layer("app").definedBy("dev.tare.app..")
                .layer("cache").definedBy("dev.tare.cache..")
                .layer("workspace").definedBy("dev.tare.workspace..")
                .layer("engines").definedBy("dev.tare.lint..", "dev.tare.rewrite..", "dev.tare.overlap..",
                        "dev.tare.calibrate..")
                .layer("config").definedBy("dev.tare.config..")
                .layer("template").definedBy("dev.tare.template..", "dev.tare.structure..")
                .layer("footprint").definedBy("dev.tare.footprint..")
                .layer("tokenize").definedBy("dev.tare.tokenize..")
                .layer("source").definedBy("dev.tare.source..")
                .whereLayer("cli").mayNotBeAccessedByAnyLayer()
                .whereLayer("report").mayOnlyBeAccessedByLayers("cli")
                .whereLayer("app").mayOnlyBeAccessedByLayers("cli", "report")
                .whereLayer("cache").mayOnlyBeAccessedByLayers("app", "report", "cli")
                .whereLayer("workspace").mayOnlyBeAccessedByLayers("app", "report", "cli")
                .whereLayer("engines").mayOnlyBeAccessedByLayers("cache", "workspace", "app", "report", "cli")
                .whereLayer("config").mayOnlyBeAccessedByLayers("engines", "cache", "workspace", "app", "report", "cli")
                .whereLayer("template").mayOnlyBeAccessedByLayers("footprint", "config", "engines", "cache",
                        "workspace", "app", "report", "cli")
                .whereLayer("footprint").mayOnlyBeAccessedByLayers("config", "engines", "cache", "workspace", "app",
                        "report", "cli")
                .whereLayer("tokenize").mayOnlyBeAccessedByLayers("template", "footprint", "config", "engines",
                        "cache", "workspace", "app", "report", "cli")
                .check(main);
    }

    @Test
    void noTwoPackagesDependOnEachOther() {
        slices().matching("dev.tare.(*)..").should().beFreeOfCycles().check(main);
    }

    @Test
    void theEnginesReadAndWriteNoFiles() {
        noClasses().that().resideInAnyPackage("dev.tare.lint..", "dev.tare.rewrite..", "dev.tare.overlap..",
                        "dev.tare.calibrate..")
                .should().dependOnClassesThat().belongToAnyOf(Files.class, FileChannel.class, FileInputStream.class,
                        FileOutputStream.class, FileReader.class, FileWriter.class, RandomAccessFile.class)
                .orShould().dependOnClassesThat().resideInAnyPackage("dev.tare.workspace..", "dev.tare.cache..")
                .because("lint, rewrite, overlap and calibrate take text in and give results out; the app layer does the I/O")
                .check(main);
    }

    @Test
    void onlyTheTokenizerFileUsesTheTokenizersLibrary() {
        noClasses().that().doNotHaveFullyQualifiedName("dev.tare.tokenize.TokenizerFile")
                .should().dependOnClassesThat().resideInAnyPackage("ai.djl..")
                .because("TokenizerFile switches the library's usage reports off before it makes a tokenizer")
                .check(main);
    }

    @Test
    void everyClassHasANameOfItsOwn() {
        Map<String, List<String>> byName = main.stream()
                .filter(type -> !type.isNestedClass() && !type.isAnonymousClass())
                .collect(Collectors.groupingBy(JavaClass::getSimpleName, TreeMap::new,
                        Collectors.mapping(JavaClass::getName, Collectors.toList())));
        byName.values().removeIf(names -> names.size() == 1);
        assertEquals(Map.of(), byName, "classes that share a simple name");
    }
}

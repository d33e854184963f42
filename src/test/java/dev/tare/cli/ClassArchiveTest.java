package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Which class-data archive beside the jar the pre-commit hook is given, and how --timings reports it. */
class ClassArchiveTest {
    @TempDir
    Path dir;
    private Path jdk;
    private Path jar;

    @BeforeEach
    void aJdkAndAJar() throws Exception {
        jdk = Files.createDirectories(dir.resolve("jdk"));
        Files.writeString(jdk.resolve("release"), "IMPLEMENTOR=\"Someone\"\nJAVA_RUNTIME_VERSION=\"17.0.99+1-test\"\nJAVA_VERSION=\"17.0.99\"\n");
        jar = Files.writeString(Files.createDirectories(dir.resolve("target")).resolve("tare.jar"), "not really a jar");
    }

    private String identity() throws Exception {
        return jdk.toRealPath() + " 17.0.99+1-test";
    }

    @Test
    void namesTheJdkByItsRealPathAndRuntimeVersion() throws Exception {
        assertEquals(Optional.of(identity()), ClassArchive.identity(jdk));
        Path link = Files.createSymbolicLink(dir.resolve("current-jdk"), jdk);
        assertEquals(Optional.of(identity()), ClassArchive.identity(link), "a link to the JDK is the same JDK");
        Files.writeString(jdk.resolve("release"), "JAVA_VERSION=\"17\"\n");
        assertEquals(Optional.empty(), ClassArchive.identity(jdk), "no runtime version, no identity");
        assertEquals(Optional.empty(), ClassArchive.identity(dir.resolve("nowhere")));
    }

    @Test
    void givesTheArchiveOnlyToTheJdkThatMadeIt() throws Exception {
        assertEquals(List.of(), ClassArchive.options(jdk, jar), "no archive");
        Path jsa = Files.writeString(jar.resolveSibling("tare.jsa"), "archive");
        assertEquals(List.of(), ClassArchive.options(jdk, jar), "an archive without a stamp is not trusted");
        Files.writeString(jar.resolveSibling("tare.jsa.jdk"), "/usr/lib/jvm/another-jdk 17.0.99+1-test\n");
        assertEquals(List.of(), ClassArchive.options(jdk, jar), "made by another JDK");
        Files.writeString(jar.resolveSibling("tare.jsa.jdk"), identity() + "\n");
        assertEquals(List.of("-XX:SharedArchiveFile=" + jsa.toAbsolutePath(), "-Xshare:auto", "-Xlog:cds*=off"),
                ClassArchive.options(jdk, jar));
        Files.delete(jsa);
        assertEquals(List.of(), ClassArchive.options(jdk, jar), "a stamp without its archive");
    }

    @Test
    void anAheadOfTimeCacheComesWithItsOwnLoggingSwitch() throws Exception {
        Path aot = Files.writeString(jar.resolveSibling("tare.aot"), "cache");
        Files.writeString(jar.resolveSibling("tare.aot.jdk"), identity() + "\n");
        assertEquals(List.of("-XX:AOTCache=" + aot.toAbsolutePath(), "-Xlog:aot*=off,cds*=off"), ClassArchive.options(jdk, jar));
    }

    @Test
    void thisJvmHasAnIdentityTheLauncherCanReadToo() {
        Optional<String> identity = ClassArchive.identity(Path.of(System.getProperty("java.home")));
        assertTrue(identity.isPresent(), "the JDK running the tests has a release file naming its version");
        assertTrue(identity.get().endsWith(" " + System.getProperty("java.runtime.version")), identity.get());
    }

    @Test
    void reportsWhetherTheArchiveIsInUse() {
        assertEquals("none", ClassArchive.status(List.of("-Xmx1g"), "mixed mode, sharing"));
        assertEquals("in use", ClassArchive.status(List.of("-XX:SharedArchiveFile=/x/tare.jsa", "-Xshare:auto"), "mixed mode, sharing"));
        assertEquals("in use", ClassArchive.status(List.of("-XX:AOTCache=/x/tare.aot"), "mixed mode, sharing"));
        assertTrue(ClassArchive.status(List.of("-XX:AOTCache=/x/tare.aot"), "mixed mode").startsWith("not used"));
    }
}

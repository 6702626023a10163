package org.ringsweep.runner.engine;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.condition.DisabledOnOs;
import org.junit.jupiter.api.condition.OS;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.testing.Ngspice;

/** Stopping the program (Ctrl-C, SIGTERM) stops the ngspice runs it started. */
@DisabledOnOs(OS.WINDOWS)
class ShutdownTests {
    @TempDir
    Path work;

    @Test
    void stoppingTheJvmMidRunKillsItsNgspice() throws Exception {
        Path ngspice = Ngspice.require();
        String java = ProcessHandle.current().info().command().orElseThrow();
        Process jvm = new ProcessBuilder(java, "-cp", System.getProperty("java.class.path"),
                ShutdownHookProbe.class.getName(), ngspice.toString(), work.toString())
                .redirectOutput(ProcessBuilder.Redirect.DISCARD).redirectError(ProcessBuilder.Redirect.DISCARD).start();
        try {
            Optional<ProcessHandle> child = Optional.empty();
            for (int i = 0; i < 200 && child.isEmpty(); i++) {
                Thread.sleep(50);
                child = jvm.children().filter(p -> p.info().command().orElse("").contains("ngspice")).findFirst();
            }
            assertTrue(child.isPresent(), "ngspice never started under the probe JVM");

            jvm.destroy(); // SIGTERM: the JVM runs its shutdown hooks, as on Ctrl-C (SIGINT)
            assertTrue(jvm.waitFor(10, TimeUnit.SECONDS), "probe JVM did not exit");
            ProcessHandle ng = child.get();
            for (int i = 0; i < 40 && ng.isAlive(); i++) {
                Thread.sleep(50);
            }
            assertTrue(!ng.isAlive(), "ngspice " + ng.pid() + " outlived the JVM that started it");
        } finally {
            List.of(jvm.toHandle()).forEach(ProcessHandle::destroyForcibly);
        }
    }
}

package org.ringsweep.runner.bench;

import java.util.ArrayList;
import java.util.List;
import org.ringsweep.runner.cli.Main;

/** The command line of a ringsweep run in a child JVM: this JVM's java binary and class path. */
final class ChildJvm {
    private ChildJvm() {
    }

    /**
     * {@code java OPTIONS -cp CLASSPATH org.ringsweep.runner.cli.Main ARGS}.
     *
     * @param jvmOptions options for the child JVM (heap, logging, class-data archive)
     * @param args       the ringsweep command and its arguments
     */
    static List<String> ringsweep(List<String> jvmOptions, List<String> args) {
        List<String> command = new ArrayList<>();
        command.add(ProcessHandle.current().info().command().orElse("java"));
        command.addAll(jvmOptions);
        command.addAll(List.of("-cp", System.getProperty("java.class.path"), Main.class.getName()));
        command.addAll(args);
        return List.copyOf(command);
    }
}

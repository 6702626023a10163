package org.ringsweep.runner.engine;

import java.util.Map;
import java.util.Objects;

/** Resolves the {@code --engine} option to an engine, given the environment. */
public final class EngineSelector {

    private EngineSelector() {
    }

    /**
     * The engine for a choice: {@code ngspice} looks for ngspice with {@link NgspiceEngine#locate};
     * {@code builtin} is the in-process engine; {@code auto} is ngspice when found, else the
     * built-in engine.
     *
     * @param choice the {@code --engine} value
     * @param env    the environment (normally {@link System#getenv()})
     * @return the engine, ready to run
     * @throws EngineNotFoundException for {@code ngspice} when it is not found, saying what was looked for and how to fix it
     */
    public static SimulationEngine select(EngineChoice choice, Map<String, String> env) {
        Objects.requireNonNull(choice, "choice");
        Objects.requireNonNull(env, "env");
        switch (choice) {
            case BUILTIN:
                return new org.ringsweep.runner.engine.builtin.BuiltinEngine();
            case NGSPICE:
                return NgspiceEngine.locate(env).orElseThrow(() ->
                        new EngineNotFoundException("ngspice not found: " + NgspiceEngine.whyNotFound(env)));
            case AUTO:
            default:
                // ngspice is the sign-off engine; without it the built-in engine runs (it refuses,
                // per point, circuits it cannot solve, such as sub-circuit text).
                return NgspiceEngine.locate(env).<SimulationEngine>map(e -> e)
                        .orElseGet(org.ringsweep.runner.engine.builtin.BuiltinEngine::new);
        }
    }

    /**
     * Same as {@link #select(EngineChoice, Map)} with the option's text.
     *
     * @throws IllegalArgumentException for an unknown choice
     * @throws EngineNotFoundException  when the chosen engine is not available
     */
    public static SimulationEngine select(String choice, Map<String, String> env) {
        return select(EngineChoice.parse(choice), env);
    }
}

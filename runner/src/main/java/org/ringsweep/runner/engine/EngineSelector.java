package org.ringsweep.runner.engine;

import java.util.Map;
import java.util.Objects;

/** Resolves the {@code --engine} option to an engine, given the environment. */
public final class EngineSelector {
    /** What a user is told when the built-in engine is asked for or would be the fallback. */
    static final String BUILTIN_MISSING = "the built-in engine is not available in this version;"
            + " install ngspice (apt-get install ngspice) or set " + NgspiceEngine.BINARY_VARIABLE;

    private EngineSelector() {
    }

    /**
     * The engine for a choice: {@code ngspice} and {@code auto} look for ngspice with
     * {@link NgspiceEngine#locate}; {@code builtin} is not available yet.
     *
     * @param choice the {@code --engine} value
     * @param env    the environment (normally {@link System#getenv()})
     * @return the engine, ready to run
     * @throws EngineNotFoundException saying what was looked for and how to fix it
     */
    public static SimulationEngine select(EngineChoice choice, Map<String, String> env) {
        Objects.requireNonNull(choice, "choice");
        Objects.requireNonNull(env, "env");
        switch (choice) {
            case BUILTIN:
                throw new EngineNotFoundException(BUILTIN_MISSING);
            case NGSPICE:
                return NgspiceEngine.locate(env).orElseThrow(() ->
                        new EngineNotFoundException("ngspice not found: " + NgspiceEngine.whyNotFound(env)));
            case AUTO:
            default:
                return NgspiceEngine.locate(env).orElseThrow(() ->
                        new EngineNotFoundException("no simulation engine found: " + NgspiceEngine.whyNotFound(env)
                                + " (the built-in engine is not available in this version)"));
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

package org.ringsweep.runner.engine;

/** Why a simulation gave no usable waveforms. */
public enum FailureKind {
    /**
     * The engine rejected the deck or part of it: a parse error, an unknown parameter or command,
     * a missing include file, an element without a usable value.
     */
    SYNTAX,
    /** The solver gave up: no operating point, or the time step shrank below its minimum. */
    CONVERGENCE,
    /** The circuit matrix was singular: a floating node or a loop of ideal sources. */
    SINGULAR_MATRIX,
    /** The run took longer than the job's timeout (or was stopped from outside) and was killed. */
    TIMEOUT,
    /**
     * The solver stopped advancing simulated time (time step collapse) and the run was killed; a
     * retry with conservative options usually helps (for ngspice, {@code .options method=gear}).
     */
    STALLED,
    /** The engine ended abnormally or reported an error not recognised by the other kinds. */
    CRASH,
    /** The engine finished but no usable raw output exists: file absent, unreadable or lacking a probe. */
    MISSING_OUTPUT,
    /** The raw output ends before the job's stop time or holds an incomplete record. */
    TRUNCATED_OUTPUT,
    /** No engine could be found or started. */
    ENGINE_NOT_FOUND,
    /** Writing the deck or reading the results failed on the file system. */
    IO,
    /**
     * The engine cannot simulate an element of the circuit (e.g. sub-circuit text in the built-in
     * engine) or the form of the job; the message names the element.
     */
    UNSUPPORTED
}

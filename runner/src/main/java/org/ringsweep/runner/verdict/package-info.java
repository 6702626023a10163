/**
 * Limits and verdicts: the limits of a net (layered with its receiver's) resolved into numbers
 * with the documented defaults ({@code formats.md} "Results"), and each edge's measurements
 * checked against them, every violation named by its limit key with a message a board engineer
 * can act on.
 *
 * <p>Tier: internal (runner only; not for plugins).
 */
package org.ringsweep.runner.verdict;

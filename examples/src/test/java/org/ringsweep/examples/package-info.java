/**
 * End-to-end checks over the invented demo board.
 *
 * <p>Tier: tests only.
 */
package org.ringsweep.examples;

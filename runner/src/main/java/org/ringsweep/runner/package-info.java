/**
 * The ringsweep application: input files, engines, measurements, verdicts, result records and
 * the command line.
 *
 * <p>Tier: internal. Nothing here is API for plugins.
 */
package org.ringsweep.runner;

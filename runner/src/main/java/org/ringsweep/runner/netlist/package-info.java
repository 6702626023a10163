/**
 * Reading board netlists: IPC-D-356A bare-board test netlists ({@link org.ringsweep.runner.netlist.Ipc356Reader}),
 * plain CSV pin lists ({@link org.ringsweep.runner.netlist.PinListCsvReader}), detected by
 * {@link org.ringsweep.runner.netlist.NetlistReader}, and per-net length tables exported from a layout
 * ({@link org.ringsweep.runner.netlist.LengthTableReader}). Every result is a plain immutable value;
 * every problem is an {@link org.ringsweep.runner.input.InputException} naming the file and line.
 *
 * <p>Coordinates are kept in metres (SI), whatever unit the file used.
 *
 * <p>Tier: internal (used by the importer and the command line).
 */
package org.ringsweep.runner.netlist;

/**
 * From a board netlist to a folder of net files: the board mapping file
 * ({@code format: ringsweep/board-1}, {@link org.ringsweep.runner.importer.BoardMappingLoader}), pin
 * classification by glob, joining nets through series parts, net classes, the topology (a length
 * table, or a driver-rooted rectilinear minimum spanning tree of the pin coordinates,
 * {@link org.ringsweep.runner.importer.RectilinearTree}) and writing one {@code ringsweep/net-1}
 * file per included net ({@link org.ringsweep.runner.importer.BoardImporter}).
 *
 * <p>Tier: internal (used by the command line).
 */
package org.ringsweep.runner.importer;

/**
 * Reports for people and for CI servers: {@code report.html} (one self-contained file with SVG
 * waveform and sweep plots) and {@code junit.xml} (one test case per net, receiver and edge),
 * written at the end of {@code check}, {@code sweep} and {@code tune} and rebuilt by
 * {@code ringsweep report OUT_DIR}. {@link org.ringsweep.runner.report.Reports} is the entry point.
 *
 * <p>Tier: internal. The file names and what the files hold are the user-facing contract
 * ({@code formats.md}, "Commands"); the classes may change.
 */
package org.ringsweep.runner.report;

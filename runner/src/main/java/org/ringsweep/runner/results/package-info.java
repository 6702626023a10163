/**
 * Result records ({@code ringsweep/result-1}) and their JSON Lines form.
 *
 * <p>Tier: internal; the JSON shape is the user-facing contract of {@code formats.md}.
 */
package org.ringsweep.runner.results;

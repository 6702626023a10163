/**
 * Running many points: a worker pool that hands each finished record to one writer, with a
 * progress display. Results do not depend on the number of workers.
 *
 * <p>Tier: internal.
 */
package org.ringsweep.runner.batch;

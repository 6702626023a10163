/**
 * The results journal of a sweep: an SQLite file {@code OUT/results.sqlite} that commits every
 * finished point as it finishes, keyed by the net file's content hash and the point key, so that
 * {@code --resume} re-runs only unfinished points; plus its JSON Lines and CSV exports and the
 * default "best point per net" objective. The schema is documented for {@code sqlite3} users in
 * {@code docs/results-store.md}.
 *
 * <p>Tier: internal to the runner; the file's schema is user-facing (documented and versioned).
 */
package org.ringsweep.runner.store;

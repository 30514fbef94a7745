/**
 * Bounds shared by the schemas of several entry points. Client-safe.
 */

/** Largest revision number a save may name (a PostgreSQL integer column holds it). */
export const MAX_REVISION = 2 ** 31 - 1;

/** Largest amount of money in any field, in the project's currency (a sane ceiling; also keeps sums finite). */
export const MAX_MONEY = 1e12;

/** Most bins a bin table (and a per-bin load profile) may hold: 12 months × 1 K bins over −70…70 °C is 1,680. */
export const MAX_BINS = 2000;

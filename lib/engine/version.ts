/**
 * Version of the engine's formulas. Stored results are recomputed when it changes: bump the minor
 * number for any change that moves a result, the major one for a change of the result's shape.
 */
export const ENGINE_VERSION = "2.1.0";

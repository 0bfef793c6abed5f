/**
 * @module engine/version
 * The engine's version, written on every result and sheet.
 */
/** Changes whenever a method or a default changes a number, so a sheet can be verified against the engine that made it. */
export const ENGINE_VERSION = "hoopwise-engine/0.5.1";

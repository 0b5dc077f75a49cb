/**
 * Version of the feature definitions. Cached feature values (src/run/feature-cache.ts) are
 * keyed by it: raise it whenever a change to this folder can change any computed value,
 * quality figure or reason, so that no cache anywhere serves values of an older definition.
 */
export const FEATURE_DEFINITIONS_VERSION = 1;

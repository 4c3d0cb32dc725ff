/**
 * Confidence tags of the catalogue constants tables.
 *
 * - VERIFIED: seen in published text (or in public code reproducing it), reference given.
 * - COMPUTED: derived here from a stated formula and other tabulated values.
 * - MEMORY: recalled from the cited source, not checked against it.
 * - MEMORY-low: recalled, unsure of a digit or more; a plausibility value.
 */
export type ConfidenceTag = 'VERIFIED' | 'COMPUTED' | 'MEMORY' | 'MEMORY-low'

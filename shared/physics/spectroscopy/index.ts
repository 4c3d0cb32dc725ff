/**
 * Spectroscopy of the physics engine: line records and tables, isotopologue data and partition
 * functions, intensity temperature scaling, line widths, the Faddeeva/Voigt function, line
 * shapes with wing cutoff, and the fixed-width line-record parser.
 */
export * from './line'
export * from './isotopologues'
export * from './isotopologue-lookup'
export * from './partition-function'
export * from './intensity'
export * from './widths'
export * from './faddeeva'
export * from './line-shape'
export * from './line-record-parser'

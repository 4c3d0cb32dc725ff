/**
 * The built-in line catalogue: constants tables, the linear-molecule band generator and partition
 * functions, the generator registry and the catalogue file format.
 */
export * from './constants/confidence'
export * from './constants/linear-levels'
export * from './constants/linear-broadening'
export * from './constants/linear-bands'
export * from './linear/rotational-energy'
export * from './linear/spin-statistics'
export * from './linear/honl-london'
export * from './linear/einstein-a'
export * from './linear/partition-function'
export * from './linear/band-generator'
export * from './registry'
export * from './sha256'
export * from './catalogue-file'

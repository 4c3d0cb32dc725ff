/**
 * Public API of the atmosphere module: the U.S. Standard Atmosphere 1976, parametric
 * climatologies, humidity conversions, hydrostatic heights, analytic ozone, and level → layer
 * column amounts with Curtis–Godson means.
 */
export * from './us-standard-1976'
export * from './us-standard-1976-profile'
export * from './humidity'
export * from './hydrostatic'
export * from './ozone'
export * from './water-vapour-profile'
export * from './profile-gases'
export * from './climatology'
export * from './layers'
export * from './tropopause'
export * from './column-summary'

/**
 * Public API of the profiles module: level-table units and conversions, physical checks of
 * level lists, and sounding uploads (parse → guess columns → convert to levels). Pure functions,
 * usable by the server and the browser alike.
 */
export * from './units'
export * from './level-checks'
export * from './format'
export * from './sounding/issues'
export * from './sounding/cells'
export * from './sounding/parse'
export * from './sounding/columns'
export * from './sounding/climatology-extension'
export * from './sounding/to-levels'

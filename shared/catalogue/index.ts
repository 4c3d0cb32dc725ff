/**
 * The built-in line catalogue: constants tables, the linear-molecule and asymmetric-top/CH4 band
 * generators and partition functions, the generator registry, the catalogue's partition-function
 * look-up and the catalogue file format.
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
export {
  ASYMMETRIC_CATALOGUE_BANDS,
  ASYMMETRIC_CATALOGUE_GENERATORS,
  LEVEL_SUM_PARTITION_FUNCTION_RANGE_K,
  METHANE_DEFAULT_OPTIONS,
  METHANE_NU4,
  OZONE_BANDS,
  OZONE_DEFAULT_OPTIONS,
  OZONE_STATES,
  WATER_BANDS,
  WATER_DEFAULT_OPTIONS,
  WATER_STATES,
  createMethanePartitionFunction,
  createOzonePartitionFunction,
  createWaterPartitionFunction,
  generateMethaneLines,
  generateOzoneLines,
  generateWaterLines,
  methaneSpinWeightedDegeneracy,
} from './asymmetric'
export type {
  AsymmetricCatalogueBand,
  AsymmetricCatalogueGenerator,
  AsymmetricCatalogueMolecule,
  AsymmetricTopBand,
  AsymmetricTopState,
  MethaneLineOptions,
  OzoneLineOptions,
  SphericalTopBand,
  WaterLineOptions,
} from './asymmetric'
export * from './registry'
export * from './partition-functions'
export * from './sha256'
export * from './catalogue-file'

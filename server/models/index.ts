import type { Sequelize } from 'sequelize'
import { GasMixture } from './gas-mixture.model'
import { CatalogueLineBlock, LineCatalogue, initLineCatalogueModels } from './line-catalogue.model'
import { Profile } from './profile.model'
import { Run, RunChunk, RunResult } from './run.model'
import { User } from './user.model'

/** Initialises every model on a Sequelize instance; associations are wired after all exist. */
export function initModels(sequelize: Sequelize) {
  User.initModel(sequelize)
  Profile.initModel(sequelize)
  GasMixture.initModel(sequelize)
  Run.initModel(sequelize)
  RunChunk.initModel(sequelize)
  RunResult.initModel(sequelize)

  Profile.belongsTo(User, { as: 'owner', foreignKey: 'ownerId' })
  GasMixture.belongsTo(User, { as: 'owner', foreignKey: 'ownerId' })
  Run.belongsTo(User, { as: 'owner', foreignKey: 'ownerId' })
  Run.hasMany(RunChunk, { as: 'chunks', foreignKey: 'runId' })
  RunChunk.belongsTo(Run, { foreignKey: 'runId' })
  Run.hasOne(RunResult, { as: 'result', foreignKey: 'runId' })
  initLineCatalogueModels(sequelize, User)
  return { User, Profile, GasMixture, Run, RunChunk, RunResult }
}

export { GasMixture, Profile, Run, RunChunk, RunResult, User }
export { CatalogueLineBlock, LineCatalogue }

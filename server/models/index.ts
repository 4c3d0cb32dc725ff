import type { Sequelize } from 'sequelize'
import { GasMixture } from './gas-mixture.model'
import { CatalogueLineBlock, LineCatalogue, initLineCatalogueModels } from './line-catalogue.model'
import { Profile } from './profile.model'
import { Review } from './review.model'
import { Run, RunChunk, RunResult } from './run.model'
import { Sweep } from './sweep.model'
import { User } from './user.model'

/** Initialises every model on a Sequelize instance; associations are wired after all exist. */
export function initModels(sequelize: Sequelize) {
  User.initModel(sequelize)
  Profile.initModel(sequelize)
  GasMixture.initModel(sequelize)
  Run.initModel(sequelize)
  RunChunk.initModel(sequelize)
  RunResult.initModel(sequelize)
  Review.initModel(sequelize)
  Sweep.initModel(sequelize)

  Profile.belongsTo(User, { as: 'owner', foreignKey: 'ownerId' })
  GasMixture.belongsTo(User, { as: 'owner', foreignKey: 'ownerId' })
  Run.belongsTo(User, { as: 'owner', foreignKey: 'ownerId' })
  Run.hasMany(RunChunk, { as: 'chunks', foreignKey: 'runId' })
  RunChunk.belongsTo(Run, { foreignKey: 'runId' })
  Run.hasOne(RunResult, { as: 'result', foreignKey: 'runId' })
  Run.hasMany(Review, { as: 'reviews', foreignKey: 'runId' })
  Review.belongsTo(Run, { foreignKey: 'runId' })
  Review.belongsTo(User, { as: 'reviewer', foreignKey: 'reviewerId' })
  Sweep.belongsTo(User, { as: 'owner', foreignKey: 'ownerId' })
  Sweep.hasMany(Run, { as: 'members', foreignKey: 'sweepId' })
  initLineCatalogueModels(sequelize, User)
  return { User, Profile, GasMixture, Run, RunChunk, RunResult, Review, Sweep }
}

export { GasMixture, Profile, Review, Run, RunChunk, RunResult, Sweep, User }
export { CatalogueLineBlock, LineCatalogue }

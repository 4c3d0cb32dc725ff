import type { Sequelize } from 'sequelize'
import { GasMixture } from './gas-mixture.model'
import { Profile } from './profile.model'
import { User } from './user.model'

/** Initialises every model on a Sequelize instance; associations are wired after all exist. */
export function initModels(sequelize: Sequelize) {
  User.initModel(sequelize)
  Profile.initModel(sequelize)
  GasMixture.initModel(sequelize)

  Profile.belongsTo(User, { as: 'owner', foreignKey: 'ownerId' })
  GasMixture.belongsTo(User, { as: 'owner', foreignKey: 'ownerId' })
  return { User, Profile, GasMixture }
}

export { GasMixture, Profile, User }

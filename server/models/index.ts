import type { Sequelize } from 'sequelize'
import { User } from './user.model'

/** Initialises every model on a Sequelize instance; associations are wired after all exist. */
export function initModels(sequelize: Sequelize) {
  User.initModel(sequelize)
  return { User }
}

export { User }

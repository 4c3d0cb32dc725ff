import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize'
import type { LevelInput, ProfileDerived } from '../../shared/schemas/profiles'
import type { User } from './user.model'

/** An atmosphere profile: levels in fixed SI units (JSONB) plus cached column totals. */
export class Profile extends Model<InferAttributes<Profile>, InferCreationAttributes<Profile>> {
  declare id: CreationOptional<number>
  declare name: string
  declare description: string
  declare source: 'climatology' | 'us-standard-1976' | 'form' | 'sounding'
  declare sourceDetails: Record<string, unknown>
  declare surfaceTemperatureK: number
  declare surfaceEmissivity: number
  declare levels: LevelInput[]
  declare derived: ProfileDerived
  declare ownerId: ForeignKey<User['id']>
  declare owner?: NonAttribute<User>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): typeof Profile {
    Profile.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        source: { type: DataTypes.STRING(32), allowNull: false },
        sourceDetails: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        surfaceTemperatureK: { type: DataTypes.DOUBLE, allowNull: false },
        surfaceEmissivity: { type: DataTypes.DOUBLE, allowNull: false },
        levels: { type: DataTypes.JSONB, allowNull: false },
        derived: { type: DataTypes.JSONB, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'profiles', modelName: 'Profile' },
    )
    return Profile
  }
}

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
import type { MixtureGases } from '../../shared/schemas/mixtures'
import type { User } from './user.model'

/** A gas mixture: per gas a uniform mole fraction, a scale on the profile's amount, or per-level values. */
export class GasMixture extends Model<InferAttributes<GasMixture>, InferCreationAttributes<GasMixture>> {
  declare id: CreationOptional<number>
  declare name: string
  declare description: string
  declare gases: MixtureGases
  declare ownerId: ForeignKey<User['id']>
  declare owner?: NonAttribute<User>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): typeof GasMixture {
    GasMixture.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        gases: { type: DataTypes.JSONB, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'gas_mixtures', modelName: 'GasMixture' },
    )
    return GasMixture
  }
}

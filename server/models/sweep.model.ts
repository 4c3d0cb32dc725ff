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
import type { SweptGas } from '../../shared/schemas/sweeps'
import type { User } from './user.model'

/**
 * A concentration sweep: member runs (runs.sweep_id) that differ only in the amount of one gas,
 * computed chunk by chunk together. Each member is an ordinary run with its own frozen inputs.
 */
export class Sweep extends Model<InferAttributes<Sweep>, InferCreationAttributes<Sweep>> {
  declare id: CreationOptional<number>
  declare name: string
  declare gas: SweptGas
  /** Unit of the amounts: ppmv for CO₂, ppbv for CH₄ and N₂O. */
  declare unit: string
  /** The members' amounts, in member order. */
  declare amounts: number[]
  /** The amount forcings are taken against (one of `amounts`). */
  declare referenceAmount: number
  declare ownerId: ForeignKey<User['id']>
  declare owner?: NonAttribute<User>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): typeof Sweep {
    Sweep.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(160), allowNull: false },
        gas: { type: DataTypes.STRING(8), allowNull: false },
        unit: { type: DataTypes.STRING(8), allowNull: false },
        amounts: { type: DataTypes.JSONB, allowNull: false },
        referenceAmount: { type: DataTypes.DOUBLE, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'sweeps', modelName: 'Sweep' },
    )
    return Sweep
  }
}

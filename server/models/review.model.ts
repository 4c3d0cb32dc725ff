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
import type { ReviewState } from '../../shared/schemas/reviews'
import type { Run } from './run.model'
import type { User } from './user.model'

/** A reviewer's verdict on a finished run; never edited, so it has no updatedAt. */
export class Review extends Model<InferAttributes<Review>, InferCreationAttributes<Review>> {
  declare id: CreationOptional<number>
  declare runId: ForeignKey<Run['id']>
  declare reviewerId: ForeignKey<User['id']>
  declare reviewer?: NonAttribute<User>
  declare state: ReviewState
  declare comment: string
  /** Hex SHA-256 over the canonical review record. */
  declare signature: string
  /** Hex SHA-256 of the run's stored results at review time. */
  declare resultsDigest: string
  /** Also the signing time: it is part of the signed record. */
  declare createdAt: Date

  static initModel(sequelize: Sequelize): typeof Review {
    Review.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        state: { type: DataTypes.STRING(24), allowNull: false },
        comment: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        signature: { type: DataTypes.STRING(64), allowNull: false },
        resultsDigest: { type: DataTypes.STRING(64), allowNull: false },
        createdAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'reviews', modelName: 'Review', updatedAt: false },
    )
    return Review
  }
}

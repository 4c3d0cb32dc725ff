import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize'
import type { PublicUser, Role } from '../../shared/schemas/auth'

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>
  declare email: string
  declare displayName: string
  declare role: Role
  declare passwordHash: string
  declare active: CreationOptional<boolean>
  declare lastSignInAt: Date | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  toPublic(): PublicUser {
    return {
      id: this.id,
      email: this.email,
      displayName: this.displayName,
      role: this.role,
      active: this.active,
      lastSignInAt: this.lastSignInAt ? this.lastSignInAt.toISOString() : null,
      createdAt: this.createdAt.toISOString(),
    }
  }

  static initModel(sequelize: Sequelize): typeof User {
    User.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
        displayName: { type: DataTypes.STRING(120), allowNull: false },
        role: { type: DataTypes.ENUM('analyst', 'reviewer', 'admin'), allowNull: false },
        passwordHash: { type: DataTypes.STRING(255), allowNull: false },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        lastSignInAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'users', modelName: 'User' },
    )
    return User
  }
}

import { DataTypes } from 'sequelize'
import type { Migration } from '../migrator'

export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('users', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    display_name: { type: DataTypes.STRING(120), allowNull: false },
    role: { type: DataTypes.ENUM('analyst', 'reviewer', 'admin'), allowNull: false },
    password_hash: { type: DataTypes.STRING(255), allowNull: false },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    last_sign_in_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  })
}

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('users')
  await qi.sequelize.query('DROP TYPE IF EXISTS "enum_users_role"')
}

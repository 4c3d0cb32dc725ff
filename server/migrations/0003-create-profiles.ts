import { DataTypes } from 'sequelize'
import type { Migration } from '../migrator'

export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('profiles', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    source: { type: DataTypes.STRING(32), allowNull: false },
    source_details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    surface_temperature_k: { type: DataTypes.DOUBLE, allowNull: false },
    surface_emissivity: { type: DataTypes.DOUBLE, allowNull: false },
    levels: { type: DataTypes.JSONB, allowNull: false },
    derived: { type: DataTypes.JSONB, allowNull: false },
    owner_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  })
  await qi.addIndex('profiles', ['owner_id'])
  await qi.addIndex('profiles', ['updated_at'])
}

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('profiles')
}

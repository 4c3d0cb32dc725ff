import { DataTypes } from 'sequelize'
import type { Migration } from '../migrator'

export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('gas_mixtures', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    gases: { type: DataTypes.JSONB, allowNull: false },
    owner_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  })
  await qi.addIndex('gas_mixtures', ['owner_id'])
}

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('gas_mixtures')
}

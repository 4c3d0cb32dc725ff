import { DataTypes } from 'sequelize'
import type { Migration } from '../migrator'

export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('line_catalogues', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    kind: { type: DataTypes.STRING(16), allowNull: false },
    source_file_name: { type: DataTypes.STRING(255), allowNull: false },
    provenance: { type: DataTypes.JSONB, allowNull: false },
    merge_with_builtin: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    line_count: { type: DataTypes.INTEGER, allowNull: false },
    block_count: { type: DataTypes.INTEGER, allowNull: false },
    min_wavenumber_cm: { type: DataTypes.DOUBLE, allowNull: false },
    max_wavenumber_cm: { type: DataTypes.DOUBLE, allowNull: false },
    checksum: { type: DataTypes.STRING(80), allowNull: false },
    owner_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'RESTRICT',
    },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  })
  await qi.addIndex('line_catalogues', ['owner_id'])
  await qi.addIndex('line_catalogues', ['created_at'])
  await qi.createTable('catalogue_line_blocks', {
    catalogue_id: {
      type: DataTypes.INTEGER,
      primaryKey: true,
      references: { model: 'line_catalogues', key: 'id' },
      onDelete: 'CASCADE',
    },
    block_index: { type: DataTypes.INTEGER, primaryKey: true },
    line_count: { type: DataTypes.INTEGER, allowNull: false },
    min_wavenumber_cm: { type: DataTypes.DOUBLE, allowNull: false },
    max_wavenumber_cm: { type: DataTypes.DOUBLE, allowNull: false },
    data: { type: DataTypes.BLOB, allowNull: false },
  })
  // Packed floating-point columns do not compress: store them out of line without trying.
  await qi.sequelize.query(
    'ALTER TABLE catalogue_line_blocks ALTER COLUMN data SET STORAGE EXTERNAL',
  )
}

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('catalogue_line_blocks')
  await qi.dropTable('line_catalogues')
}

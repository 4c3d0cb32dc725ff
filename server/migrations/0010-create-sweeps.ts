import { DataTypes } from 'sequelize'
import type { Migration } from '../migrator'

// A sweep: runs that differ only in the amount of one gas, computed together so that what does
// not depend on that gas is computed once (shared/physics/engine/compute-sweep.ts).
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('sweeps', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(160), allowNull: false },
    gas: { type: DataTypes.STRING(8), allowNull: false },
    unit: { type: DataTypes.STRING(8), allowNull: false },
    amounts: { type: DataTypes.JSONB, allowNull: false },
    reference_amount: { type: DataTypes.DOUBLE, allowNull: false },
    owner_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'RESTRICT',
    },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  })
  await qi.addConstraint('sweeps', {
    type: 'check',
    name: 'sweeps_gas_check',
    fields: ['gas'],
    where: { gas: ['CO2', 'CH4', 'N2O'] },
  })
  // A member run keeps its own inputs and results; deleting the sweep leaves the runs.
  await qi.addColumn('runs', 'sweep_id', {
    type: DataTypes.INTEGER,
    allowNull: true,
    references: { model: 'sweeps', key: 'id' },
    onDelete: 'SET NULL',
  })
  await qi.addColumn('runs', 'sweep_amount', { type: DataTypes.DOUBLE, allowNull: true })
  await qi.addIndex('runs', ['sweep_id'])
}

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('runs', 'sweep_amount')
  await qi.removeColumn('runs', 'sweep_id')
  await qi.dropTable('sweeps')
}

import { DataTypes } from 'sequelize'
import type { Migration } from '../migrator'

// The full-resolution window of a run lives beside the binned results, so the results page and
// the list never load it unless asked.
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('run_results', 'detail', { type: DataTypes.JSONB, allowNull: true })
}

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('run_results', 'detail')
}

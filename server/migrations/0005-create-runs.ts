import { DataTypes } from 'sequelize'
import type { Migration } from '../migrator'

export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('runs', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(160), allowNull: false },
    status: { type: DataTypes.STRING(16), allowNull: false },
    inputs: { type: DataTypes.JSONB, allowNull: false },
    input_hash: { type: DataTypes.STRING(64), allowNull: false },
    engine_version: { type: DataTypes.STRING(32), allowNull: false },
    chunk_count: { type: DataTypes.INTEGER, allowNull: false },
    chunks_done: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    error: { type: DataTypes.TEXT, allowNull: true },
    queued_at: { type: DataTypes.DATE, allowNull: false },
    started_at: { type: DataTypes.DATE, allowNull: true },
    finished_at: { type: DataTypes.DATE, allowNull: true },
    compute_ms: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    owner_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  })
  await qi.addIndex('runs', ['owner_id'])
  await qi.addIndex('runs', ['status'])
  await qi.addIndex('runs', ['input_hash'])
  await qi.createTable('run_chunks', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    run_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'runs', key: 'id' }, onDelete: 'CASCADE' },
    chunk_index: { type: DataTypes.INTEGER, allowNull: false },
    start_cm: { type: DataTypes.DOUBLE, allowNull: false },
    end_cm: { type: DataTypes.DOUBLE, allowNull: false },
    status: { type: DataTypes.STRING(16), allowNull: false },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    job_id: { type: DataTypes.STRING(64), allowNull: true },
    worker_id: { type: DataTypes.STRING(120), allowNull: true },
    result: { type: DataTypes.JSONB, allowNull: true },
    error: { type: DataTypes.TEXT, allowNull: true },
    compute_ms: { type: DataTypes.DOUBLE, allowNull: true },
    started_at: { type: DataTypes.DATE, allowNull: true },
    finished_at: { type: DataTypes.DATE, allowNull: true },
  })
  await qi.addIndex('run_chunks', ['run_id', 'chunk_index'], { unique: true })
  await qi.createTable('run_results', {
    run_id: { type: DataTypes.INTEGER, primaryKey: true, references: { model: 'runs', key: 'id' }, onDelete: 'CASCADE' },
    summary: { type: DataTypes.JSONB, allowNull: false },
    data: { type: DataTypes.JSONB, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  })
}

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('run_results')
  await qi.dropTable('run_chunks')
  await qi.dropTable('runs')
}

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
import type { RunInputs, RunStatus } from '../../shared/schemas/runs'
import type { User } from './user.model'

/** A line-by-line calculation: frozen inputs, status and progress; results live in run_results. */
export class Run extends Model<InferAttributes<Run>, InferCreationAttributes<Run>> {
  declare id: CreationOptional<number>
  declare name: string
  declare status: RunStatus
  declare inputs: RunInputs
  declare inputHash: string
  declare engineVersion: string
  declare chunkCount: number
  declare chunksDone: CreationOptional<number>
  declare error: string | null
  declare queuedAt: Date
  declare startedAt: Date | null
  declare finishedAt: Date | null
  /** Sum of the chunks' compute time, ms. */
  declare computeMs: CreationOptional<number>
  declare ownerId: ForeignKey<User['id']>
  declare owner?: NonAttribute<User>
  /** The sweep the run is a member of (computed together with the other members), if any. */
  declare sweepId: CreationOptional<number | null>
  /** The swept gas's amount in this member, in the sweep's unit. */
  declare sweepAmount: CreationOptional<number | null>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): typeof Run {
    Run.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(160), allowNull: false },
        status: { type: DataTypes.STRING(16), allowNull: false },
        inputs: { type: DataTypes.JSONB, allowNull: false },
        inputHash: { type: DataTypes.STRING(64), allowNull: false },
        engineVersion: { type: DataTypes.STRING(32), allowNull: false },
        chunkCount: { type: DataTypes.INTEGER, allowNull: false },
        chunksDone: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        error: { type: DataTypes.TEXT, allowNull: true },
        queuedAt: { type: DataTypes.DATE, allowNull: false },
        startedAt: { type: DataTypes.DATE, allowNull: true },
        finishedAt: { type: DataTypes.DATE, allowNull: true },
        computeMs: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
        sweepId: { type: DataTypes.INTEGER, allowNull: true, defaultValue: null },
        sweepAmount: { type: DataTypes.DOUBLE, allowNull: true, defaultValue: null },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'runs', modelName: 'Run' },
    )
    return Run
  }
}

/** One spectral chunk of a run: the unit of queued work. */
export class RunChunk extends Model<InferAttributes<RunChunk>, InferCreationAttributes<RunChunk>> {
  declare id: CreationOptional<number>
  declare runId: ForeignKey<Run['id']>
  declare chunkIndex: number
  declare startCm: number
  declare endCm: number
  declare status: 'pending' | 'running' | 'done' | 'failed' | 'cancelled'
  declare attempts: CreationOptional<number>
  declare jobId: string | null
  declare workerId: string | null
  declare result: Record<string, unknown> | null
  declare error: string | null
  declare computeMs: number | null
  declare startedAt: Date | null
  declare finishedAt: Date | null

  static initModel(sequelize: Sequelize): typeof RunChunk {
    RunChunk.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        chunkIndex: { type: DataTypes.INTEGER, allowNull: false },
        startCm: { type: DataTypes.DOUBLE, allowNull: false },
        endCm: { type: DataTypes.DOUBLE, allowNull: false },
        status: { type: DataTypes.STRING(16), allowNull: false },
        attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        jobId: { type: DataTypes.STRING(64), allowNull: true },
        workerId: { type: DataTypes.STRING(120), allowNull: true },
        result: { type: DataTypes.JSON, allowNull: true },
        error: { type: DataTypes.TEXT, allowNull: true },
        computeMs: { type: DataTypes.DOUBLE, allowNull: true },
        startedAt: { type: DataTypes.DATE, allowNull: true },
        finishedAt: { type: DataTypes.DATE, allowNull: true },
      },
      { sequelize, tableName: 'run_chunks', modelName: 'RunChunk', timestamps: false },
    )
    return RunChunk
  }
}

/** The merged results of a finished run, kept apart so run lists stay light. */
export class RunResult extends Model<InferAttributes<RunResult>, InferCreationAttributes<RunResult>> {
  declare runId: ForeignKey<Run['id']>
  declare summary: Record<string, unknown>
  declare data: Record<string, unknown>
  /** Full-resolution spectra of the detail window (null when the run asked for none). */
  declare detail: CreationOptional<Record<string, unknown> | null>
  declare createdAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): typeof RunResult {
    RunResult.init(
      {
        runId: { type: DataTypes.INTEGER, primaryKey: true },
        summary: { type: DataTypes.JSONB, allowNull: false },
        // Plain json: written once, read whole (migration 0009).
        data: { type: DataTypes.JSON, allowNull: false },
        detail: { type: DataTypes.JSON, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'run_results', modelName: 'RunResult', updatedAt: false },
    )
    return RunResult
  }
}

import {
  CreationOptional, DataTypes, InferAttributes, InferCreationAttributes, Model, Sequelize,
} from 'sequelize';
import type { RunOptions, RunStatus, RunView } from './run.schemas';

/** A model run: its inputs, engine version, options, status, results and timing, kept for reproduction. */
export class Run extends Model<InferAttributes<Run>, InferCreationAttributes<Run>> {
  declare id: CreationOptional<number>;
  declare stockId: number;
  declare datasetId: number;
  declare model: string;
  declare options: RunOptions;
  declare status: RunStatus;
  declare progress: CreationOptional<number>;
  declare stage: string | null;
  declare engineVersion: string;
  declare results: string | null;
  declare error: string | null;
  declare durationMs: number | null;
  declare createdBy: number;
  /** Times a worker claimed the run (more than one only when a stalled run was retried). */
  declare attempts: CreationOptional<number>;
  /** The worker process (host:pid) that claimed it last. */
  declare worker: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare startedAt: Date | null;
  declare finishedAt: Date | null;

  toView(datasetVersion: number | null = null): RunView {
    return {
      id: this.id, stockId: this.stockId, datasetId: this.datasetId, datasetVersion, model: this.model, options: this.options,
      status: this.status, progress: this.progress, stage: this.stage, engineVersion: this.engineVersion, error: this.error,
      durationMs: this.durationMs, createdBy: this.createdBy, createdAt: this.createdAt.toISOString(),
      startedAt: this.startedAt?.toISOString() ?? null, finishedAt: this.finishedAt?.toISOString() ?? null,
    };
  }

  static initModel(sequelize: Sequelize): void {
    Run.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        stockId: { type: DataTypes.INTEGER, allowNull: false, field: 'stock_id' },
        datasetId: { type: DataTypes.INTEGER, allowNull: false, field: 'dataset_id' },
        model: { type: DataTypes.STRING(40), allowNull: false },
        options: { type: DataTypes.JSON, allowNull: false },
        status: { type: DataTypes.ENUM('queued', 'running', 'succeeded', 'failed', 'cancelled'), allowNull: false },
        progress: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0 },
        stage: { type: DataTypes.STRING(120), allowNull: true },
        engineVersion: { type: DataTypes.STRING(20), allowNull: false, field: 'engine_version' },
        results: { type: DataTypes.TEXT('long'), allowNull: true },
        error: { type: DataTypes.TEXT, allowNull: true },
        durationMs: { type: DataTypes.INTEGER, allowNull: true, field: 'duration_ms' },
        createdBy: { type: DataTypes.INTEGER, allowNull: false, field: 'created_by' },
        attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        worker: { type: DataTypes.STRING(120), allowNull: true },
        createdAt: { type: DataTypes.DATE, field: 'created_at' },
        startedAt: { type: DataTypes.DATE, allowNull: true, field: 'started_at' },
        finishedAt: { type: DataTypes.DATE, allowNull: true, field: 'finished_at' },
      },
      { sequelize, tableName: 'runs', modelName: 'Run', updatedAt: false },
    );
  }
}

import {
  CreationOptional, DataTypes, InferAttributes, InferCreationAttributes, Model, Sequelize,
} from 'sequelize';
import type { ProposalFigures, ProposalView } from './proposal.schemas';

/** A quota proposal drafted from a run; frozen once submitted (later edits make a new draft). */
export class Proposal extends Model<InferAttributes<Proposal>, InferCreationAttributes<Proposal>> {
  declare id: CreationOptional<number>;
  declare stockId: number;
  declare runId: number;
  declare revisesId: number | null;
  declare status: 'draft' | 'submitted';
  declare quota: number;
  /** Predator catch of a pair proposal on linked stocks (the prey catch is `quota`); null for single stocks. */
  declare predatorQuota: CreationOptional<number | null>;
  declare rationale: string;
  declare figures: ProposalFigures;
  declare createdBy: number;
  declare submittedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  toView(createdByName: string | null = null): ProposalView {
    return {
      id: this.id, stockId: this.stockId, runId: this.runId, revisesId: this.revisesId, status: this.status, quota: this.quota, predatorQuota: this.predatorQuota ?? null,
      rationale: this.rationale, figures: this.figures, createdBy: this.createdBy, createdByName,
      submittedAt: this.submittedAt?.toISOString() ?? null, createdAt: this.createdAt.toISOString(), updatedAt: this.updatedAt.toISOString(),
    };
  }

  static initModel(sequelize: Sequelize): void {
    Proposal.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        stockId: { type: DataTypes.INTEGER, allowNull: false, field: 'stock_id' },
        runId: { type: DataTypes.INTEGER, allowNull: false, field: 'run_id' },
        revisesId: { type: DataTypes.INTEGER, allowNull: true, field: 'revises_id' },
        status: { type: DataTypes.ENUM('draft', 'submitted'), allowNull: false },
        quota: { type: DataTypes.DOUBLE, allowNull: false },
        predatorQuota: { type: DataTypes.DOUBLE, allowNull: true, field: 'predator_quota' },
        rationale: { type: DataTypes.TEXT, allowNull: false },
        figures: { type: DataTypes.JSON, allowNull: false },
        createdBy: { type: DataTypes.INTEGER, allowNull: false, field: 'created_by' },
        submittedAt: { type: DataTypes.DATE, allowNull: true, field: 'submitted_at' },
        createdAt: { type: DataTypes.DATE, field: 'created_at' },
        updatedAt: { type: DataTypes.DATE, field: 'updated_at' },
      },
      { sequelize, tableName: 'proposals', modelName: 'Proposal' },
    );
  }
}

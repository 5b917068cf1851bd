/** The quota board's records: its rules, comments, votes and decisions. */
import { CreationOptional, DataTypes, InferAttributes, InferCreationAttributes, Model, Sequelize, type Transaction } from 'sequelize';

export class BoardRules extends Model<InferAttributes<BoardRules>, InferCreationAttributes<BoardRules>> {
  declare id: number;
  declare quorum: number;
  declare majority: number;
  /** The chair may correct a published limit alone; otherwise a correction needs a new board vote. */
  declare chairMayCorrect: CreationOptional<boolean>;
  declare updatedBy: number | null;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    BoardRules.init({
      id: { type: DataTypes.INTEGER, primaryKey: true },
      quorum: { type: DataTypes.INTEGER, allowNull: false },
      majority: { type: DataTypes.DOUBLE, allowNull: false },
      chairMayCorrect: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true, field: 'chair_may_correct' },
      updatedBy: { type: DataTypes.INTEGER, allowNull: true, field: 'updated_by' },
      updatedAt: { type: DataTypes.DATE, field: 'updated_at' },
    }, { sequelize, tableName: 'board_rules', modelName: 'BoardRules', createdAt: false });
  }

  /** The rules now in force, as recorded with a correction. */
  static async snapshot(transaction?: Transaction): Promise<RulesSnapshot> {
    const r = (await BoardRules.findByPk(1, { transaction }))!;
    return { quorum: r.quorum, majority: r.majority, chairMayCorrect: r.chairMayCorrect, updatedAt: r.updatedAt.toISOString() };
  }
}

export class Comment extends Model<InferAttributes<Comment>, InferCreationAttributes<Comment>> {
  declare id: CreationOptional<number>;
  declare proposalId: number;
  declare parentId: number | null;
  declare authorId: number;
  declare body: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Comment.init({
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      proposalId: { type: DataTypes.INTEGER, allowNull: false, field: 'proposal_id' },
      parentId: { type: DataTypes.INTEGER, allowNull: true, field: 'parent_id' },
      authorId: { type: DataTypes.INTEGER, allowNull: false, field: 'author_id' },
      body: { type: DataTypes.TEXT, allowNull: false },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
    }, { sequelize, tableName: 'comments', modelName: 'Comment', updatedAt: false });
  }
}

export type VoteChoice = 'approve' | 'reject' | 'abstain';

export class Vote extends Model<InferAttributes<Vote>, InferCreationAttributes<Vote>> {
  declare id: CreationOptional<number>;
  declare proposalId: number;
  declare voterId: number;
  declare choice: VoteChoice;
  declare reason: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Vote.init({
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      proposalId: { type: DataTypes.INTEGER, allowNull: false, field: 'proposal_id' },
      voterId: { type: DataTypes.INTEGER, allowNull: false, field: 'voter_id' },
      choice: { type: DataTypes.ENUM('approve', 'reject', 'abstain'), allowNull: false },
      reason: { type: DataTypes.TEXT, allowNull: false },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
      updatedAt: { type: DataTypes.DATE, field: 'updated_at' },
    }, { sequelize, tableName: 'votes', modelName: 'Vote' });
  }
}

export interface VoteCount { approve: number; reject: number; abstain: number }

export class Decision extends Model<InferAttributes<Decision>, InferCreationAttributes<Decision>> {
  declare id: CreationOptional<number>;
  declare proposalId: number;
  declare outcome: 'approved' | 'rejected';
  declare approvedLimit: number | null;
  declare reason: string;
  declare override: boolean;
  declare votes: VoteCount;
  declare decidedBy: number;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Decision.init({
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      proposalId: { type: DataTypes.INTEGER, allowNull: false, field: 'proposal_id' },
      outcome: { type: DataTypes.ENUM('approved', 'rejected'), allowNull: false },
      approvedLimit: { type: DataTypes.DOUBLE, allowNull: true, field: 'approved_limit' },
      reason: { type: DataTypes.TEXT, allowNull: false },
      override: { type: DataTypes.BOOLEAN, allowNull: false },
      votes: { type: DataTypes.JSON, allowNull: false },
      decidedBy: { type: DataTypes.INTEGER, allowNull: false, field: 'decided_by' },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
    }, { sequelize, tableName: 'decisions', modelName: 'Decision', updatedAt: false });
  }
}

/** The board rules as they stood when a correction was made. */
export interface RulesSnapshot { quorum: number; majority: number; chairMayCorrect: boolean; updatedAt: string }

/**
 * The decision record of a correction: the chair alone (where the rules allow it) or a new board vote on a
 * revised proposal. The corrected advisory supersedes the earlier one, which stays as it was.
 */
export class Correction extends Model<InferAttributes<Correction>, InferCreationAttributes<Correction>> {
  declare id: CreationOptional<number>;
  declare advisoryId: number;
  declare supersedesAdvisoryId: number;
  /** The proposal whose published limit is corrected. */
  declare proposalId: number;
  /** The decision behind the corrected advisory (the original one for a chair's correction, the new vote's otherwise). */
  declare decisionId: number;
  declare kind: 'chair' | 'vote';
  declare correctedLimit: number;
  declare previousLimit: number;
  declare reason: string;
  declare override: boolean;
  declare votes: VoteCount | null;
  declare rules: RulesSnapshot;
  declare decidedBy: number;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Correction.init({
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      advisoryId: { type: DataTypes.INTEGER, allowNull: false, field: 'advisory_id' },
      supersedesAdvisoryId: { type: DataTypes.INTEGER, allowNull: false, field: 'supersedes_advisory_id' },
      proposalId: { type: DataTypes.INTEGER, allowNull: false, field: 'proposal_id' },
      decisionId: { type: DataTypes.INTEGER, allowNull: false, field: 'decision_id' },
      kind: { type: DataTypes.ENUM('chair', 'vote'), allowNull: false },
      correctedLimit: { type: DataTypes.DOUBLE, allowNull: false, field: 'corrected_limit' },
      previousLimit: { type: DataTypes.DOUBLE, allowNull: false, field: 'previous_limit' },
      reason: { type: DataTypes.TEXT, allowNull: false },
      override: { type: DataTypes.BOOLEAN, allowNull: false },
      votes: { type: DataTypes.JSON, allowNull: true },
      rules: { type: DataTypes.JSON, allowNull: false },
      decidedBy: { type: DataTypes.INTEGER, allowNull: false, field: 'decided_by' },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
    }, { sequelize, tableName: 'corrections', modelName: 'Correction', updatedAt: false });
  }
}

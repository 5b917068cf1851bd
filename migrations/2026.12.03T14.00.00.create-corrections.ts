import { DataTypes, QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

const ref = (model: string, allowNull = false) => ({ type: DataTypes.INTEGER, allowNull, references: { model, key: 'id' }, onDelete: 'RESTRICT' });

/** A correction of a published limit is a decision of its own: by a new board vote, or by the chair alone where the rules allow it. */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.addColumn('board_rules', 'chair_may_correct', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true });
  await qi.createTable('corrections', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    advisory_id: { ...ref('advisories'), unique: true },
    supersedes_advisory_id: ref('advisories'),
    proposal_id: ref('proposals'),
    decision_id: ref('decisions'),
    kind: { type: DataTypes.ENUM('chair', 'vote'), allowNull: false },
    corrected_limit: { type: DataTypes.DOUBLE, allowNull: false },
    previous_limit: { type: DataTypes.DOUBLE, allowNull: false },
    reason: { type: DataTypes.TEXT, allowNull: false },
    override: { type: DataTypes.BOOLEAN, allowNull: false },
    votes: { type: DataTypes.JSON, allowNull: true },
    rules: { type: DataTypes.JSON, allowNull: false },
    decided_by: ref('users'),
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('corrections');
  await qi.removeColumn('board_rules', 'chair_may_correct');
}

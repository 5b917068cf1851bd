import { DataTypes, QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

const ref = (model: string, allowNull = false) => ({ type: DataTypes.INTEGER, allowNull, references: { model, key: 'id' }, onDelete: 'RESTRICT' });
const at = (allowNull = false) => ({ type: DataTypes.DATE, allowNull });

export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.addColumn('users', 'board_chair', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });
  await qi.createTable('board_rules', {
    id: { type: DataTypes.INTEGER, primaryKey: true },
    quorum: { type: DataTypes.INTEGER, allowNull: false },
    majority: { type: DataTypes.DOUBLE, allowNull: false },
    updated_by: ref('users', true),
    updated_at: at(),
  });
  await qi.bulkInsert('board_rules', [{ id: 1, quorum: 2, majority: 0.5, updated_by: null, updated_at: new Date() }]);
  await qi.createTable('comments', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    proposal_id: ref('proposals'), parent_id: ref('comments', true), author_id: ref('users'),
    body: { type: DataTypes.TEXT, allowNull: false }, created_at: at(),
  });
  await qi.createTable('votes', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    proposal_id: ref('proposals'), voter_id: ref('users'),
    choice: { type: DataTypes.ENUM('approve', 'reject', 'abstain'), allowNull: false },
    reason: { type: DataTypes.TEXT, allowNull: false }, created_at: at(), updated_at: at(),
  });
  await qi.addIndex('votes', ['proposal_id', 'voter_id'], { unique: true });
  await qi.createTable('decisions', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    proposal_id: { ...ref('proposals'), unique: true },
    outcome: { type: DataTypes.ENUM('approved', 'rejected'), allowNull: false },
    approved_limit: { type: DataTypes.DOUBLE, allowNull: true },
    reason: { type: DataTypes.TEXT, allowNull: false },
    override: { type: DataTypes.BOOLEAN, allowNull: false },
    votes: { type: DataTypes.JSON, allowNull: false },
    decided_by: ref('users'), created_at: at(),
  });
  await qi.createTable('advisories', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    doc_id: { type: DataTypes.STRING(40), allowNull: false, unique: true },
    stock_id: ref('stocks'), region_id: ref('regions'), decision_id: ref('decisions'),
    supersedes_id: ref('advisories', true), superseded_by_id: ref('advisories', true),
    approved_limit: { type: DataTypes.DOUBLE, allowNull: false },
    override: { type: DataTypes.BOOLEAN, allowNull: false },
    title: { type: DataTypes.STRING(200), allowNull: false },
    summary: { type: DataTypes.TEXT, allowNull: false },
    pdf: { type: DataTypes.BLOB('long'), allowNull: false },
    sha256: { type: DataTypes.STRING(64), allowNull: false },
    published_by: ref('users'), published_at: at(),
  });
  await qi.createTable('subscriptions', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    user_id: ref('users'), region_id: ref('regions'),
    plan: { type: DataTypes.ENUM('monthly', 'yearly'), allowNull: false },
    stripe_customer_id: { type: DataTypes.STRING(80), allowNull: false },
    stripe_checkout_id: { type: DataTypes.STRING(80), allowNull: false, unique: true },
    stripe_subscription_id: { type: DataTypes.STRING(80), allowNull: true, unique: true },
    status: { type: DataTypes.ENUM('pending', 'active', 'past_due', 'canceled'), allowNull: false },
    cancel_at_period_end: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    current_period_end: at(true), created_at: at(), updated_at: at(),
  });
  await qi.createTable('stripe_events', {
    id: { type: DataTypes.STRING(80), primaryKey: true },
    type: { type: DataTypes.STRING(80), allowNull: false },
    received_at: at(),
  });
  await qi.createTable('invoices', {
    id: { type: DataTypes.STRING(80), primaryKey: true },
    subscription_id: ref('subscriptions'),
    amount: { type: DataTypes.INTEGER, allowNull: false },
    currency: { type: DataTypes.STRING(3), allowNull: false },
    status: { type: DataTypes.STRING(20), allowNull: false },
    period_start: at(), period_end: at(), created_at: at(),
  });
  await qi.createTable('outbox', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    dedupe_key: { type: DataTypes.STRING(120), allowNull: false, unique: true },
    to_address: { type: DataTypes.STRING(190), allowNull: false },
    subject: { type: DataTypes.STRING(250), allowNull: false },
    body: { type: DataTypes.TEXT, allowNull: false },
    advisory_id: ref('advisories', true),
    status: { type: DataTypes.ENUM('pending', 'sending', 'sent', 'failed'), allowNull: false },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    last_error: { type: DataTypes.TEXT, allowNull: true },
    message_id: { type: DataTypes.STRING(250), allowNull: true },
    next_attempt_at: at(), sent_at: at(true), created_at: at(),
  });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  for (const t of ['outbox', 'invoices', 'stripe_events', 'subscriptions', 'advisories', 'decisions', 'votes', 'comments', 'board_rules']) await qi.dropTable(t);
  await qi.removeColumn('users', 'board_chair');
}

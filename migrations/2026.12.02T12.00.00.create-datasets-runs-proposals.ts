import { DataTypes, QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

const ref = (model: string, allowNull = false) => ({
  type: DataTypes.INTEGER, allowNull, references: { model, key: 'id' }, onDelete: 'RESTRICT',
});

export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.createTable('datasets', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    stock_id: ref('stocks'),
    version: { type: DataTypes.INTEGER, allowNull: false },
    note: { type: DataTypes.STRING(500), allowNull: false },
    kind: { type: DataTypes.ENUM('single', 'predator-prey'), allowNull: false },
    csv_text: { type: DataTypes.TEXT('medium'), allowNull: false },
    first_year: { type: DataTypes.INTEGER, allowNull: false },
    last_year: { type: DataTypes.INTEGER, allowNull: false },
    index_names: { type: DataTypes.JSON, allowNull: false },
    created_by: ref('users'),
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('datasets', ['stock_id', 'version'], { unique: true });
  await qi.createTable('runs', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    stock_id: ref('stocks'),
    dataset_id: ref('datasets'),
    model: { type: DataTypes.STRING(40), allowNull: false },
    options: { type: DataTypes.JSON, allowNull: false },
    status: { type: DataTypes.ENUM('queued', 'running', 'succeeded', 'failed', 'cancelled'), allowNull: false },
    progress: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0 },
    stage: { type: DataTypes.STRING(120), allowNull: true },
    engine_version: { type: DataTypes.STRING(20), allowNull: false },
    results: { type: DataTypes.TEXT('long'), allowNull: true },
    error: { type: DataTypes.TEXT, allowNull: true },
    duration_ms: { type: DataTypes.INTEGER, allowNull: true },
    created_by: ref('users'),
    created_at: { type: DataTypes.DATE, allowNull: false },
    started_at: { type: DataTypes.DATE, allowNull: true },
    finished_at: { type: DataTypes.DATE, allowNull: true },
  });
  await qi.addIndex('runs', ['stock_id']);
  await qi.createTable('proposals', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    stock_id: ref('stocks'),
    run_id: ref('runs'),
    revises_id: ref('proposals', true),
    status: { type: DataTypes.ENUM('draft', 'submitted'), allowNull: false },
    quota: { type: DataTypes.DOUBLE, allowNull: false },
    rationale: { type: DataTypes.TEXT, allowNull: false },
    figures: { type: DataTypes.JSON, allowNull: false },
    created_by: ref('users'),
    submitted_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('proposals');
  await qi.dropTable('runs');
  await qi.dropTable('datasets');
}

import type { QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

// The figures a run list shows, kept beside the results blob by MariaDB itself (stored generated
// columns): every writer of `results`, old rows included, fills them, and a list never reads the blob.
const SURPLUS = `JSON_VALUE(results, '$.kind') = 'surplus'`;
export const RUN_SUMMARY_COLUMNS: Record<string, string> = {
  sum_log_lik: `JSON_VALUE(results, '$.fit.logLik')`,
  sum_aic: `JSON_VALUE(results, '$.fit.aic')`,
  sum_msy: `CASE WHEN ${SURPLUS} THEN JSON_VALUE(results, '$.fit.reference.msy') END`,
  sum_fold_harvest: `CASE WHEN ${SURPLUS} THEN JSON_VALUE(results, '$.fold.hStar') END`,
  sum_b_over_bmsy: `CASE WHEN ${SURPLUS} THEN JSON_VALUE(results, '$.fit.status.bOverBmsy') END`,
  sum_f_over_fmsy: `CASE WHEN ${SURPLUS} THEN JSON_VALUE(results, '$.fit.status.fOverFmsy') END`,
  sum_proposed_quota: `CASE WHEN ${SURPLUS} THEN JSON_VALUE(results, '$.quota.proposal.proposed') END`,
};

export async function up({ context: qi }: Ctx): Promise<void> {
  const add = Object.entries(RUN_SUMMARY_COLUMNS).map(([name, expr]) => `ADD COLUMN ${name} DOUBLE AS (${expr}) PERSISTENT`);
  await qi.sequelize.query(`ALTER TABLE runs ${add.join(', ')}`);
  // the list reads one stock's runs newest first, a page at a time
  await qi.addIndex('runs', ['stock_id', 'id'], { name: 'runs_stock_id_id' });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.removeIndex('runs', 'runs_stock_id_id');
  await qi.sequelize.query(`ALTER TABLE runs ${Object.keys(RUN_SUMMARY_COLUMNS).map((c) => `DROP COLUMN ${c}`).join(', ')}`);
}

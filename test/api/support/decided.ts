/** Builds a submitted proposal for a stock: a finished run with a bootstrap, a draft, submitted. */
import { Dataset } from '../../../api/datasets/dataset.model';
import { Stock } from '../../../api/stocks/stock.model';
import { finished, waitForRun } from './runs';
import type { SignedIn } from './test-app';

export async function submittedProposal(assessor: SignedIn, stockCode: string, quotaFactor = 0.8) {
  const stock = (await Stock.findOne({ where: { code: stockCode } }))!;
  const datasetId = (await Dataset.findOne({ where: { stockId: stock.id, version: 1 } }))!.id;
  const start = await assessor.agent.post('/api/runs').set('x-csrf-token', assessor.csrf).send({ datasetId, model: 'schaefer', bootstrap: 150, seed: 9 }).expect(202);
  const done = await waitForRun(assessor, start.body.run.id, finished);
  const lower5 = (done.results as { quota: { proposal: { hStar: { lower5: number } } } }).quota.proposal.hStar.lower5;
  const draft = await assessor.agent.post('/api/proposals').set('x-csrf-token', assessor.csrf)
    .send({ runId: start.body.run.id, quota: Math.round(quotaFactor * lower5), rationale: 'Below the lower 5% of the fold harvest, as the board asked.' }).expect(201);
  await assessor.agent.post(`/api/proposals/${draft.body.proposal.id}/submit`).set('x-csrf-token', assessor.csrf).expect(200);
  return { stock, proposalId: draft.body.proposal.id as number, lower5 };
}

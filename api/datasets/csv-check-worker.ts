/** Worker thread of the CSV checker: answers {id, csv, lenient} with {id, check}. */
import { parentPort } from 'node:worker_threads';
import { checkCsv } from './csv-check';

parentPort!.on('message', (msg: { id: number; csv: string; lenient: boolean }) => {
  try {
    parentPort!.postMessage({ id: msg.id, check: checkCsv(msg.csv, msg.lenient) });
  } catch (err) {
    parentPort!.postMessage({ id: msg.id, error: (err as Error).message });
  }
});

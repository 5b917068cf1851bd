/** The yardstick of `npm run bench:load`: a bare Express 5 route answering a small JSON list, nothing else. */
import express from 'express';

const port = Number(process.argv[2] ?? 4399);
const app = express();
const body = { stocks: Array.from({ length: 4 }, (_, i) => ({ id: i + 1, code: `stock-${i + 1}`, name: `Stock ${i + 1}` })) };
app.get('/bare', (_req, res) => { res.json(body); });
app.listen(port, '127.0.0.1', () => console.log(`bare Express route on http://127.0.0.1:${port}/bare`));

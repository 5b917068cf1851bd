/** The advisory for a pair of catches on linked stocks: the catch-plane chart, both projections, key figures, decision, caution. */
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { ticks } from 'd3';
import PDFDocument from 'pdfkit';
import type { CatchPlane } from '../engine/linked/catch-plane';
import type { PairFigures } from '../proposals/proposal.schemas';
import { CAUTION } from './advisory-pdf';

const require = createRequire(import.meta.url);
const FONTS = join(dirname(require.resolve('@fontsource/source-sans-3/package.json')), 'files');
// why: pdfkit 0.20 crashes on accented glyphs from the woff2 files; the woff files work
const font = (w: number) => join(FONTS, `source-sans-3-latin-${w}-normal.woff`);

export interface PairAdvisoryPdfData {
  docId: string;
  stockName: string;
  regionName: string;
  unit: string;
  publishedAt: Date;
  preyLimit: number;
  predatorLimit: number;
  override: boolean;
  supersedes: { docId: string; reason: string } | null;
  pair: PairFigures;
  rayMedian: number;
  projectionYears: number;
  decision: { reason: string; votes: { approve: number; reject: number; abstain: number }; chairName: string; decidedAt: Date };
  plane: CatchPlane;
  current: { preyCatch: number; predatorCatch: number };
  cloud: { preyCatch: number; predatorCatch: number }[];
  projection: { startYear: number; prey: { median: number[]; lower: number[]; upper: number[] }; predator: { median: number[]; lower: number[]; upper: number[] } };
  fixed: { name: string; value: number; reason: string }[];
}

const INK = '#0d3b47', SEA = '#1f6f7f', BRINK = '#e08a1e', DANGER = '#b3261e', MUTED = '#5a6b70', BAND = '#cfe6ea', PRED = '#8a4f9e', HOPF = '#2e7d32';
const n0 = (v: number) => Math.round(v).toLocaleString('en-GB');
const pct = (v: number) => `${(v * 100).toFixed(1)}%`;
type Doc = InstanceType<typeof PDFDocument>;

function axes(doc: Doc, x: number, y: number, w: number, h: number, xMax: number, yMax: number, xLabel: string, yLabel: string, xOffset = 0) {
  doc.save().lineWidth(0.6).strokeColor('#9aa9ad').moveTo(x, y).lineTo(x, y + h).lineTo(x + w, y + h).stroke();
  doc.font('regular').fontSize(7).fillColor(MUTED);
  for (const v of ticks(0, xMax, 5)) doc.text(n0(v + xOffset), x + (w * v) / xMax - 20, y + h + 3, { width: 40, align: 'center' });
  for (const v of ticks(0, yMax, 4)) doc.text(n0(v), x - 44, y + h - (h * v) / yMax - 4, { width: 40, align: 'right' });
  doc.fontSize(8).text(xLabel, x, y + h + 13, { width: w, align: 'center' });
  doc.save().rotate(-90, { origin: [x - 50, y + h / 2] }).text(yLabel, x - 50 - h / 2, y + h / 2 - 4, { width: h, align: 'center' }).restore();
  doc.restore();
}

/** Prey catch across, predator catch up: fold, Hopf and predator-loss curves, the bootstrap cloud, the present and the approved pair. */
function catchPlaneChart(doc: Doc, d: PairAdvisoryPdfData, x: number, y: number, w: number, h: number) {
  const xMax = d.plane.preyMax, yMax = d.plane.predatorMax;
  const X = (v: number) => x + (Math.min(v, xMax) / xMax) * w, Y = (v: number) => y + h - (Math.min(v, yMax) / yMax) * h;
  axes(doc, x, y, w, h, xMax, yMax, `Prey catch (${d.unit} per year)`, `Predator catch (${d.unit} per year)`);
  doc.save().fillColor(BAND).fillOpacity(0.9);
  for (const c of d.cloud) doc.circle(X(c.preyCatch), Y(c.predatorCatch), 1.6).fill();
  doc.restore();
  const colours: Record<string, string> = { fold: DANGER, hopf: HOPF, transcritical: PRED };
  for (const c of d.plane.curves) {
    if (!c.points.length) continue;
    doc.save().lineWidth(1.6).strokeColor(colours[c.kind]!);
    if (c.points.length === 1) { doc.circle(X(c.points[0]!.preyCatch), Y(c.points[0]!.predatorCatch), 3).stroke(); doc.restore(); continue; }
    doc.moveTo(X(c.points[0]!.preyCatch), Y(c.points[0]!.predatorCatch));
    for (const p of c.points.slice(1)) doc.lineTo(X(p.preyCatch), Y(p.predatorCatch));
    doc.stroke().restore();
  }
  doc.save().circle(X(d.current.preyCatch), Y(d.current.predatorCatch), 3.5).fillAndStroke('#ffffff', INK).restore();
  doc.save().circle(X(d.preyLimit), Y(d.predatorLimit), 4).fillAndStroke(BRINK, INK).restore();
  doc.font('bold').fontSize(8).fillColor(INK).text(`Approved pair ${n0(d.preyLimit)} / ${n0(d.predatorLimit)}`, X(d.preyLimit) + 7, Y(d.predatorLimit) - 4);
  doc.font('regular').fontSize(7).fillColor(MUTED).text('Red: fold (the equilibrium vanishes). Green: Hopf (the equilibrium turns into a cycle). Purple ring: predator lost. Shaded dots: where each bootstrap replicate first meets a curve along the ray through the approved pair. White: the last year\'s catches.', x, y + h + 26, { width: w });
}

function projections(doc: Doc, d: PairAdvisoryPdfData, x: number, y: number, w: number, h: number) {
  const p = d.projection;
  const n = p.prey.median.length;
  const yMax = Math.max(...p.prey.upper, ...p.predator.upper) * 1.05;
  const X = (i: number) => x + (i / (n - 1)) * w, Y = (v: number) => y + h - (v / yMax) * h;
  for (const [b, colour] of [[p.prey, SEA], [p.predator, PRED]] as const) {
    doc.save().fillOpacity(0.25).moveTo(X(0), Y(b.upper[0]!));
    for (let i = 1; i < n; i++) doc.lineTo(X(i), Y(b.upper[i]!));
    for (let i = n - 1; i >= 0; i--) doc.lineTo(X(i), Y(b.lower[i]!));
    doc.closePath().fill(colour).restore();
    doc.save().lineWidth(1.8).strokeColor(colour).moveTo(X(0), Y(b.median[0]!));
    for (let i = 1; i < n; i++) doc.lineTo(X(i), Y(b.median[i]!));
    doc.stroke().restore();
  }
  axes(doc, x, y, w, h, n - 1, yMax, `Years after ${p.startYear - 1}`, `Biomass (${d.unit})`);
  doc.font('regular').fontSize(7).fillColor(MUTED).text('Teal: prey. Purple: predator. Lines: median; bands: 5–95% of the bootstrap replicates with process noise.', x, y + h + 26, { width: w });
}

/** The pair advisory as PDF bytes. */
export function renderPairAdvisoryPdf(d: PairAdvisoryPdfData): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'A4', margin: 48, info: { Title: `Harvest advisory ${d.docId}`, Author: 'Brinkmark', Subject: d.stockName }, pdfVersion: '1.7' });
  doc.registerFont('regular', font(400));
  doc.registerFont('semibold', font(600));
  doc.registerFont('bold', font(700));
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));
  doc.save().roundedRect(48, 44, 26, 26, 5).fill(SEA).restore();
  doc.font('bold').fontSize(18).fillColor(INK).text('Harvest advisory: linked stocks', 82, 44);
  doc.font('regular').fontSize(9).fillColor(MUTED).text(`Document ${d.docId} · published ${d.publishedAt.toISOString().slice(0, 10)} · Brinkmark`, 82, 66);
  doc.moveDown(1.2);
  doc.font('semibold').fontSize(13).fillColor(INK).text(`${d.stockName} — ${d.regionName}`, 48);
  if (d.supersedes) doc.font('bold').fontSize(9).fillColor(DANGER).text(`This advisory supersedes ${d.supersedes.docId}: ${d.supersedes.reason}`);
  doc.moveDown(0.4);
  doc.font('bold').fontSize(20).fillColor(INK).text(`Prey ${n0(d.preyLimit)} and predator ${n0(d.predatorLimit)} ${d.unit} per year`);
  doc.font('regular').fontSize(10).fillColor(MUTED).text('Approved pair of harvest limits, to be taken together.');
  if (d.override) doc.font('bold').fontSize(9).fillColor(DANGER).text('OVERRIDE: the board approved a pair beyond the lower 5% of the bootstrap crossing along its ray.');
  doc.moveDown(0.5);
  const a = d.pair;
  const axis = (m: PairFigures['preyAxis']) => (m.margin === null ? 'no curve met within the mapped range' : `${n0(m.margin)} ${d.unit} to the ${m.kind === 'transcritical' ? 'predator-loss' : m.kind} curve at ${n0(m.at!)}`);
  const rows: [string, string][] = [
    ['Margin raising the prey catch alone', axis(a.preyAxis)],
    ['Margin raising the predator catch alone', axis(a.predatorAxis)],
    ['Probability that the pair lies beyond a curve', `${pct(a.pCross)} (fold ${pct(a.pCrossByKind.fold ?? 0)}, Hopf ${pct(a.pCrossByKind.hopf ?? 0)})`],
    ['Median crossing along the ray, in prey catch', `${n0(d.rayMedian)} ${d.unit}`],
    [`Prey after ${d.projectionYears} years (median, 5–95%)`, `${n0(a.preyEnd.median)} (${n0(a.preyEnd.lower)}–${n0(a.preyEnd.upper)}) ${d.unit}`],
    [`Predator after ${d.projectionYears} years (median, 5–95%)`, `${n0(a.predatorEnd.median)} (${n0(a.predatorEnd.lower)}–${n0(a.predatorEnd.upper)}) ${d.unit}`],
    ['Probability of falling below the limit point: prey, predator', `${pct(a.pPreyBelowLimit)}, ${pct(a.pPredatorBelowLimit)}`],
    ['Probability of losing the prey, the predator', `${pct(a.pPreyLost)}, ${pct(a.pPredatorLost)}`],
  ];
  let ty = doc.y;
  for (const [k, v] of rows) {
    doc.font('regular').fontSize(9.5).fillColor(MUTED).text(k, 48, ty, { width: 250 });
    doc.font('semibold').fillColor(INK).text(v, 300, ty, { width: 247 });
    ty += 15;
  }
  doc.y = ty + 6;
  doc.font('semibold').fontSize(11).fillColor(INK).text('Board decision', 48);
  const v = d.decision.votes;
  doc.font('regular').fontSize(9.5).fillColor(INK).text(`Approved on ${d.decision.decidedAt.toISOString().slice(0, 10)}, recorded by the chair, ${d.decision.chairName}. Votes: ${v.approve} approve, ${v.reject} reject, ${v.abstain} abstain.`);
  doc.fillColor(MUTED).text(`Reason: ${d.decision.reason}`);
  doc.moveDown(0.6);
  const top = doc.y;
  doc.font('semibold').fontSize(10).fillColor(INK).text('The pair in the catch plane', 100, top);
  catchPlaneChart(doc, d, 100, top + 16, 440, 190);
  doc.addPage();
  doc.font('semibold').fontSize(10).fillColor(INK).text('Projected biomass of both species under the approved pair', 100, 60);
  projections(doc, d, 100, 80, 440, 170);
  doc.y = 300;
  doc.font('semibold').fontSize(11).fillColor(INK).text('Quantities fixed in the model', 48);
  for (const f of d.fixed) doc.font('regular').fontSize(9).fillColor(INK).text(`${f.name} = ${f.value}: ${f.reason}`, { width: 499 });
  doc.moveDown(0.6);
  doc.font('semibold').fontSize(11).fillColor(INK).text('Caution', 48);
  doc.font('regular').fontSize(10).fillColor(INK).text(CAUTION, { width: 499 });
  doc.moveDown(0.6);
  doc.fontSize(8.5).fillColor(MUTED).text('Method: predator-prey model fitted by maximum likelihood to both surveys and both catch series; equilibria continued in each catch; fold and Hopf curves of the catch plane refined by Newton\'s method; uncertainty from a residual bootstrap; projections with lognormal process noise. Figures were computed by the Brinkmark engine from the run named in the decision record.', { width: 499 });
  doc.moveDown(0.6).text(`Document ${d.docId}. The SHA-256 of this file is recorded with the advisory.`);
  doc.end();
  return done;
}

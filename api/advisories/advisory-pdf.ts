/** Renders an advisory as PDF with pdfkit: shipped Source Sans 3 fonts, vector charts, key figures, decision, caution. */
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { ticks } from 'd3';
import PDFDocument from 'pdfkit';
import type { FoldPoint } from '../engine/surplus/fold';
import type { ReserveDesignFigures } from '../proposals/proposal.schemas';
import { reserveMapPdf } from './reserve-map-pdf';

const require = createRequire(import.meta.url);
const FONTS = join(dirname(require.resolve('@fontsource/source-sans-3/package.json')), 'files');
// why: pdfkit 0.20 crashes on accented glyphs from the woff2 files; the woff files work
const font = (w: number) => join(FONTS, `source-sans-3-latin-${w}-normal.woff`);

export const CAUTION = 'These figures are scientific advice to a competent authority. They are subject to local regulation and licensed practice, and do not by themselves authorise any harvest.';

export interface AdvisoryPdfData {
  docId: string;
  stockName: string;
  regionName: string;
  unit: string;
  publishedAt: Date;
  limit: number;
  proposalQuota: number;
  override: boolean;
  supersedes: { docId: string; reason: string } | null;
  figures: {
    marginAbs: number; marginFrac: number; marginLowerAbs: number; marginLowerFrac: number;
    /** Where the stock stands against the unstable threshold at the limit (absent for advisories of older runs). */
    stateMargin?: { current: number; threshold: number | null; distance: number | null; fraction: number | null; returnRate: number; pCross: number; years: number };
    /** The limit is a fishing mortality F rather than a catch. */
    control?: 'catch' | 'F';
    hStar: { median: number; lower5: number; upper95: number }; msy: number; bOverBmsy: number; fOverFmsy: number;
    pPassFold: number; pBelowLimit: number; projectionYears: number;
  };
  decision: { reason: string; votes: { approve: number; reject: number; abstain: number }; chairName: string; decidedAt: Date };
  /** Set when this advisory corrects an earlier one: the correction's own record. */
  correction?: {
    kind: 'chair' | 'vote'; reason: string; votes: { approve: number; reject: number; abstain: number } | null; byName: string; at: Date; proposalId: number;
    previous: { docId: string; limit: number; votes: { approve: number; reject: number; abstain: number }; decidedAt: Date };
  } | null;
  fold: { table: FoldPoint[]; hStar: number; bFold: number; band: { p5: number; p95: number } };
  catches: number[];
  projection: { startYear: number; median: number[]; lower: number[]; upper: number[]; limitRef: number };
  /** The reserve design the board approved with the limit, if the proposal carried one. */
  reserveDesign?: ReserveDesignFigures;
}

const INK = '#0d3b47', SEA = '#1f6f7f', BRINK = '#e08a1e', DANGER = '#b3261e', MUTED = '#5a6b70', BAND = '#cfe6ea';
const n0 = (v: number) => Math.round(v).toLocaleString('en-GB');
const pct = (v: number) => `${(v * 100).toFixed(1)}%`;

type Doc = InstanceType<typeof PDFDocument>;

function axes(doc: Doc, x: number, y: number, w: number, h: number, xMax: number, yMax: number, xLabel: string, yLabel: string) {
  doc.save().lineWidth(0.6).strokeColor('#9aa9ad').moveTo(x, y).lineTo(x, y + h).lineTo(x + w, y + h).stroke();
  doc.font('regular').fontSize(7).fillColor(MUTED);
  for (const v of ticks(0, xMax, 5)) doc.text(n0(v), x + (w * v) / xMax - 20, y + h + 3, { width: 40, align: 'center' });
  for (const v of ticks(0, yMax, 4)) doc.text(n0(v), x - 44, y + h - (h * v) / yMax - 4, { width: 40, align: 'right' });
  doc.fontSize(8).text(xLabel, x, y + h + 13, { width: w, align: 'center' });
  doc.save().rotate(-90, { origin: [x - 50, y + h / 2] }).text(yLabel, x - 50 - h / 2, y + h / 2 - 4, { width: h, align: 'center' }).restore();
  doc.restore();
}

function bifurcation(doc: Doc, d: AdvisoryPdfData, x: number, y: number, w: number, h: number) {
  const xMax = Math.max(d.fold.hStar * 1.15, d.limit * 1.05, ...d.catches.map((c) => c * 1.02));
  const yMax = Math.max(...d.fold.table.map((p) => p.stable)) * 1.05;
  const X = (v: number) => x + (v / xMax) * w, Y = (v: number) => y + h - (v / yMax) * h;
  doc.save().rect(X(d.fold.band.p5), y, X(d.fold.band.p95) - X(d.fold.band.p5), h).fill(BAND).restore();
  axes(doc, x, y, w, h, xMax, yMax, `Constant harvest (${d.unit} per year)`, `Equilibrium biomass (${d.unit})`);
  doc.save().lineWidth(0.4).strokeColor('#9aa9ad');
  for (const c of d.catches) doc.moveTo(X(c), y + h).lineTo(X(c), y + h - 12).stroke();
  doc.restore();
  const path = (pts: [number, number][]) => { doc.moveTo(X(pts[0]![0]), Y(pts[0]![1])); for (const p of pts.slice(1)) doc.lineTo(X(p[0]), Y(p[1])); };
  doc.save().lineWidth(1.8).strokeColor(SEA); path(d.fold.table.map((p) => [p.h, p.stable])); doc.stroke().restore();
  doc.save().lineWidth(1.4).strokeColor(DANGER).dash(4, { space: 3 }); path(d.fold.table.map((p) => [p.h, p.unstable])); doc.stroke().undash().restore();
  doc.save().lineWidth(1.8).strokeColor(BRINK).moveTo(X(d.limit), y).lineTo(X(d.limit), y + h).stroke().restore();
  doc.save().circle(X(d.fold.hStar), Y(d.fold.bFold), 3.5).fillAndStroke(BRINK, INK).restore();
  doc.font('bold').fontSize(8).fillColor(INK).text(`Fold h* = ${n0(d.fold.hStar)}`, X(d.fold.hStar) + 6, Y(d.fold.bFold) - 4);
  doc.fillColor(BRINK).text(`Approved limit ${n0(d.limit)}`, X(d.limit) - 124, y + 2, { width: 120, align: 'right' });
  doc.font('regular').fontSize(7).fillColor(MUTED).text('Solid: stable equilibrium. Dashed: unstable threshold. Shaded: 5–95% bootstrap band of h*. Ticks: historical catches.', x, y + h + 26, { width: w });
}

function projection(doc: Doc, d: AdvisoryPdfData, x: number, y: number, w: number, h: number) {
  const p = d.projection;
  const n = p.median.length;
  const yMax = Math.max(p.limitRef, ...p.upper) * 1.05;
  const X = (i: number) => x + (i / (n - 1)) * w, Y = (v: number) => y + h - (v / yMax) * h;
  doc.save().moveTo(X(0), Y(p.upper[0]!));
  for (let i = 1; i < n; i++) doc.lineTo(X(i), Y(p.upper[i]!));
  for (let i = n - 1; i >= 0; i--) doc.lineTo(X(i), Y(p.lower[i]!));
  doc.closePath().fill(BAND).restore();
  axes(doc, x, y, w, h, n - 1, yMax, `Years after ${p.startYear - 1}`, `Biomass (${d.unit})`);
  doc.save().lineWidth(1.8).strokeColor(SEA).moveTo(X(0), Y(p.median[0]!));
  for (let i = 1; i < n; i++) doc.lineTo(X(i), Y(p.median[i]!));
  doc.stroke().restore();
  doc.save().lineWidth(1).strokeColor(DANGER).dash(4, { space: 3 }).moveTo(x, Y(p.limitRef)).lineTo(x + w, Y(p.limitRef)).stroke().undash().restore();
  doc.font('regular').fontSize(7).fillColor(DANGER).text(`Limit reference point ${n0(p.limitRef)} ${d.unit}`, x + 4, Y(p.limitRef) - 10);
}

const votesText = (v: { approve: number; reject: number; abstain: number }) => `${v.approve} approve, ${v.reject} reject, ${v.abstain} abstain`;
const day = (d: Date) => d.toISOString().slice(0, 10);

/** The decision behind this limit: the board's vote, or a correction with its own record. */
function decisionRecord(doc: Doc, d: AdvisoryPdfData): void {
  const c = d.correction;
  if (!c) {
    doc.font('semibold').fontSize(11).fillColor(INK).text('Board decision', 48);
    doc.font('regular').fontSize(9.5).fillColor(INK).text(`Approved on ${day(d.decision.decidedAt)}, recorded by the chair, ${d.decision.chairName}. Votes: ${votesText(d.decision.votes)}.`);
    doc.fillColor(MUTED).text(`Reason: ${d.decision.reason}`);
    return;
  }
  if (c.kind === 'chair') {
    doc.font('semibold').fontSize(11).fillColor(INK).text("Correction by the chair (no board vote)", 48);
    doc.font('regular').fontSize(9.5).fillColor(INK).text(`On ${day(c.at)} the chair, ${c.byName}, corrected the limit from ${n0(c.previous.limit)} to ${n0(d.limit)} ${d.unit} per year alone, under the board's rule, set by the administrator, that lets the chair correct a published limit. The board did not vote on this correction.`);
  } else {
    doc.font('semibold').fontSize(11).fillColor(INK).text('Correction by a new board vote', 48);
    doc.font('regular').fontSize(9.5).fillColor(INK).text(`On ${day(d.decision.decidedAt)} the board approved the corrected limit of ${n0(d.limit)} ${d.unit} per year (previously ${n0(c.previous.limit)}) by a new vote on proposal #${c.proposalId}, recorded by the chair, ${d.decision.chairName}. Votes on the correction: ${votesText(c.votes ?? d.decision.votes)}.`);
  }
  doc.fillColor(MUTED).text(`Reason for the correction: ${c.reason}`);
  doc.text(`Superseded advisory ${c.previous.docId}: ${n0(c.previous.limit)} ${d.unit} per year, approved on ${day(c.previous.decidedAt)} by board vote (${votesText(c.previous.votes)}); those votes were on that limit, not on this one.`);
}

/** The state margin rows: current biomass against the unstable threshold at the limit. */
function stateRows(d: AdvisoryPdfData): [string, string][] {
  const s = d.figures.stateMargin;
  if (!s) return [];
  const rows: [string, string][] = [['Harvest expressed as', d.figures.control === 'F' ? 'fishing mortality F (per year)' : `catch (${d.unit} per year)`]];
  if (s.threshold === null) return [...rows, ['State margin', 'none: the limit is past the fold, there is no stable state at it']];
  return [...rows,
    ['State margin: current biomass above the threshold', `${n0(s.distance!)} ${d.unit} (${pct(s.fraction!)}; threshold ${n0(s.threshold)} ${d.unit}, now ${n0(s.current)})`],
    ['Return rate at the limit', `${s.returnRate.toFixed(3)} per year`],
    [`Probability of crossing the threshold within ${s.years} years`, pct(s.pCross)],
  ];
}

/** The advisory as PDF bytes. */
export function renderAdvisoryPdf(d: AdvisoryPdfData): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'A4', margin: 48, info: { Title: `Harvest advisory ${d.docId}`, Author: 'Brinkmark', Subject: d.stockName }, pdfVersion: '1.7' });
  doc.registerFont('regular', font(400));
  doc.registerFont('semibold', font(600));
  doc.registerFont('bold', font(700));
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));

  doc.save().roundedRect(48, 44, 26, 26, 5).fill(SEA).restore();
  doc.save().lineWidth(2).strokeColor('#fff').moveTo(52, 65).bezierCurveTo(57, 65, 60, 50, 66, 50).bezierCurveTo(70, 50, 72, 57, 71, 65).stroke().restore();
  doc.save().circle(66, 50, 2.6).fill(BRINK).restore();
  doc.font('bold').fontSize(18).fillColor(INK).text('Harvest advisory', 82, 44);
  doc.font('regular').fontSize(9).fillColor(MUTED).text(`Document ${d.docId} · published ${d.publishedAt.toISOString().slice(0, 10)} · Brinkmark`, 82, 66);
  doc.moveDown(1.2);
  doc.font('semibold').fontSize(13).fillColor(INK).text(`${d.stockName} — ${d.regionName}`, 48);
  if (d.supersedes) doc.font('bold').fontSize(9).fillColor(DANGER).text(`This advisory supersedes ${d.supersedes.docId}: ${d.supersedes.reason}`);
  doc.moveDown(0.4);
  doc.font('bold').fontSize(26).fillColor(INK).text(`${n0(d.limit)} ${d.unit} per year`, { continued: false });
  doc.font('regular').fontSize(10).fillColor(MUTED).text(`Approved harvest limit. Margin to the fold: ${n0(d.figures.marginAbs)} ${d.unit} (${pct(d.figures.marginFrac)} of the median fold harvest).`);
  if (d.override) {
    doc.moveDown(0.3);
    const top = doc.y;
    doc.save().rect(48, top, 499, 30).fill('#fdecea').restore();
    doc.font('bold').fontSize(9).fillColor(DANGER).text('OVERRIDE: the board approved a limit above the lower 5% of the fold harvest. The stock may pass the fold with more than 5% probability.', 56, top + 6, { width: 483 });
    doc.y = top + 34;
  }
  doc.moveDown(0.6);
  const rows: [string, string][] = [
    ['Approved limit', `${n0(d.limit)} ${d.unit}/yr (proposed ${n0(d.proposalQuota)})`],
    ['Fold harvest h* (bootstrap median, 5–95%)', `${n0(d.figures.hStar.median)} (${n0(d.figures.hStar.lower5)}–${n0(d.figures.hStar.upper95)}) ${d.unit}/yr`],
    ['Margin to the fold', `${n0(d.figures.marginAbs)} ${d.unit} (${pct(d.figures.marginFrac)})`],
    ['Margin to the lower 5% of h*', `${n0(d.figures.marginLowerAbs)} ${d.unit} (${pct(d.figures.marginLowerFrac)})`],
    ['MSY', `${n0(d.figures.msy)} ${d.unit}/yr`],
    ['Status: B/B_MSY, F/F_MSY', `${d.figures.bOverBmsy.toFixed(2)}, ${d.figures.fOverFmsy.toFixed(2)}`],
    ['Probability of passing the fold at the limit', pct(d.figures.pPassFold)],
    [`Probability of falling below the limit point within ${d.figures.projectionYears} years`, pct(d.figures.pBelowLimit)],
    ...stateRows(d),
  ];
  let ty = doc.y;
  for (const [k, v] of rows) {
    doc.font('regular').fontSize(9.5).fillColor(MUTED).text(k, 48, ty, { width: 260 });
    doc.font('semibold').fillColor(INK).text(v, 310, ty, { width: 237 });
    ty += 15;
    doc.save().lineWidth(0.3).strokeColor('#dbe3e5').moveTo(48, ty - 2).lineTo(547, ty - 2).stroke().restore();
  }
  doc.y = ty + 8;
  decisionRecord(doc, d);
  doc.moveDown(0.8);
  const chartTop = doc.y;
  doc.font('semibold').fontSize(10).fillColor(INK).text('The limit against the fold', 100, chartTop);
  bifurcation(doc, d, 100, chartTop + 16, 440, 170);
  doc.addPage();
  doc.font('semibold').fontSize(10).fillColor(INK).text(`Projected biomass under the approved limit (median and 5–95%)`, 100, 60);
  projection(doc, d, 100, 80, 440, 170);
  doc.y = 300;
  if (d.reserveDesign) doc.y = reserveMapPdf(doc, d.reserveDesign, d.unit, 48, 300, 499) + 8;
  doc.font('semibold').fontSize(11).fillColor(INK).text('Caution', 48);
  doc.font('regular').fontSize(10).fillColor(INK).text(CAUTION, { width: 499 });
  doc.moveDown(0.6);
  doc.fontSize(8.5).fillColor(MUTED).text('Method: surplus-production model fitted by maximum likelihood to catches and survey indices; equilibria continued in harvest to the saddle-node (fold) point; uncertainty from a residual bootstrap; projections with lognormal process noise. Figures were computed by the Brinkmark engine from the run named in the decision record.', { width: 499 });
  doc.moveDown(0.6).text(`Document ${d.docId}. The SHA-256 of this file is recorded with the advisory; a correction is published as a new advisory that supersedes this one.`);
  doc.end();
  return done;
}

/** The chosen reserve design in an advisory PDF: equilibrium density map (cividis), reserves outlined, legend with units, key figures. */
import { interpolateCividis } from 'd3';
import type PDFDocument from 'pdfkit';
import type { ReserveDesignFigures } from '../proposals/proposal.schemas';

type Doc = InstanceType<typeof PDFDocument>;
const INK = '#0d3b47', MUTED = '#5a6b70', DANGER = '#b3261e';

/** Draws the map and its figures from (x, y) across width w; returns the y below it. */
export function reserveMapPdf(doc: Doc, d: ReserveDesignFigures, unit: string, x: number, y: number, w: number): number {
  const coast = d.ny === 1;
  const cell = coast ? w / d.nx : Math.min(w / d.nx, 220 / d.ny);
  const mapH = coast ? 36 : cell * d.ny;
  const max = Math.max(d.params.K, ...d.density);
  doc.font('semibold').fontSize(10).fillColor(INK).text(`Reserve design: ${d.name}`, x, y);
  const top = y + 16;
  d.cells.forEach((g, i) => {
    const cx = g % d.nx, cy = Math.floor(g / d.nx);
    doc.save().rect(x + cx * cell, coast ? top : top + cy * cell, cell + 0.2, coast ? mapH : cell + 0.2).fill(interpolateCividis(Math.max(0, d.density[i]!) / max)).restore();
  });
  const res = new Set(d.cells.filter((_, i) => d.reserve[i]));
  doc.save().lineWidth(1.2).strokeColor(DANGER).dash(4, { space: 1.5 });
  for (const g of res) {
    const cx = g % d.nx, cy = Math.floor(g / d.nx);
    const x0 = x + cx * cell, x1 = x0 + cell, y0 = coast ? top : top + cy * cell, y1 = coast ? top + mapH : y0 + cell;
    if (cx === 0 || !res.has(g - 1)) doc.moveTo(x0, y0).lineTo(x0, y1);
    if (cx === d.nx - 1 || !res.has(g + 1)) doc.moveTo(x1, y0).lineTo(x1, y1);
    if (coast || cy === 0 || !res.has(g - d.nx)) doc.moveTo(x0, y0).lineTo(x1, y0);
    if (coast || cy === d.ny - 1 || !res.has(g + d.nx)) doc.moveTo(x0, y1).lineTo(x1, y1);
  }
  doc.stroke().undash().restore();
  const ly = top + mapH + 8;
  doc.font('regular').fontSize(7.5).fillColor(MUTED).text(`${coast ? 'Coast' : 'Grid'} ${(d.nx * d.h).toPrecision(3)} km ${coast ? 'long' : 'wide'}; cells ${d.h.toPrecision(3)} km`, x, ly);
  const lw = 160;
  for (let i = 0; i < 32; i++) doc.save().rect(x + 200 + (i * lw) / 32, ly, lw / 32 + 0.3, 7).fill(interpolateCividis((i + 0.5) / 32)).restore();
  doc.fillColor(MUTED).text('0', x + 200, ly + 9).text(`${max.toPrecision(3)} ${unit}/${d.areaUnit}`, x + 200, ly + 9, { width: lw, align: 'right' })
    .text('Equilibrium density', x + 200, ly + 9, { width: lw, align: 'center' });
  doc.save().lineWidth(1.2).strokeColor(DANGER).dash(4, { space: 1.5 }).rect(x + 380, ly, 14, 7).stroke().undash().restore();
  doc.fillColor(INK).text('Reserve', x + 398, ly);
  const n = (v: number) => Math.round(v).toLocaleString('en-GB');
  const lines = [
    `Reserve ${d.reserveArea.toPrecision(3)} ${d.areaUnit} (${(100 * d.reserveShare).toFixed(0)}% of the habitat) in ${d.reserveCount} part(s); fishing mortality outside ${d.fishing.toFixed(2)} /yr.`,
    `Equilibrium stock ${n(d.total)} ${unit}; yield from the fished area ${n(d.yield)} ${unit}/yr; spillover across reserve edges ${n(d.spillover)} ${unit}/yr.`,
    `${d.persists ? 'The stock persists' : 'The stock does NOT persist'} under this design; ${d.criticalF === null ? 'it survives every fishing rate examined' : `it is lost at fishing mortality ${d.criticalF.toFixed(2)} /yr outside (${d.lossKind})`}.`,
    d.recoveryYears === null ? 'Recovery after a collapse: not within the horizon examined.' : `After a collapse, with the fishery closed, the stock regains 90% of its unfished size in about ${Math.round(d.recoveryYears)} years${d.frontSpeed ? ` (front ${d.frontSpeed.toFixed(2)} km/yr)` : ''}.`,
  ];
  doc.font('regular').fontSize(8.5).fillColor(INK).text(lines.join(' '), x, ly + 24, { width: w });
  return doc.y + 6;
}

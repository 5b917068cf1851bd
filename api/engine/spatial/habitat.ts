/**
 * Where a sedentary stock lives: a 1-D coastline of equal cells or a 2-D grid of square cells from a
 * region's mask, each habitable cell either fished or inside a reserve. Cells are finite volumes:
 * density is held at the cell centre; diffusion passes through shared cell faces.
 */

export type EdgeKind = 'closed' | 'lethal';

export interface Habitat {
  nx: number;
  ny: number;
  /** Cell width (km). */
  h: number;
  /** Full-grid index (row-major, y·nx + x) of each habitable cell, in unknown order. */
  cells: Int32Array;
  /** Full-grid index → unknown number, or −1 for land. */
  index: Int32Array;
  reserve: Uint8Array;
  /** What lies beyond the grid's outer edge: 'closed' (no passage) or 'lethal' (nothing survives there). */
  edge: EdgeKind;
  /** Pairs of neighbouring unknowns (i < j), one per shared face. */
  faces: Int32Array;
  /** Faces from each unknown to the lethal outside. */
  lethalFaces: Uint8Array;
  /** Largest |i − j| over faces: the half-bandwidth of the diffusion matrix. */
  band: number;
}

/** Mask codes: 0 land (or water the stock does not use), 1 fished habitat, 2 reserve. */
export type MaskCode = 0 | 1 | 2;

/** A habitat from a mask given as rows (ny rows of nx codes). */
export function habitatFromMask(mask: MaskCode[][], h: number, edge: EdgeKind = 'closed'): Habitat {
  const ny = mask.length;
  const nx = mask[0]?.length ?? 0;
  if (nx === 0 || mask.some((row) => row.length !== nx)) throw new Error('the mask must be a rectangle of cells');
  if (!(h > 0)) throw new Error('the cell width must be positive');
  const index = new Int32Array(nx * ny).fill(-1);
  const cells: number[] = [];
  const reserve: number[] = [];
  for (let y = 0; y < ny; y++) for (let x = 0; x < nx; x++) {
    const code = mask[y]![x]!;
    if (code === 0) continue;
    index[y * nx + x] = cells.length;
    cells.push(y * nx + x);
    reserve.push(code === 2 ? 1 : 0);
  }
  if (cells.length === 0) throw new Error('the mask has no habitable cell');
  const faces: number[] = [];
  const lethalFaces = new Uint8Array(cells.length);
  let band = 0;
  cells.forEach((g, i) => {
    const x = g % nx, y = Math.floor(g / nx);
    for (const [dx, dy] of [[1, 0], [-1, 0], [0, 1], [0, -1]] as const) {
      const X = x + dx, Y = y + dy;
      if (X < 0 || Y < 0 || X >= nx || Y >= ny) {
        // a 1-D coast has no faces across its width
        if (edge === 'lethal' && (ny > 1 || dy === 0)) lethalFaces[i]!++;
        continue;
      }
      const j = index[Y * nx + X]!;
      if (j > i) { faces.push(i, j); band = Math.max(band, j - i); }
    }
  });
  return { nx, ny, h, cells: Int32Array.from(cells), index, reserve: Uint8Array.from(reserve), edge, faces: Int32Array.from(faces), lethalFaces, band: Math.max(band, 1) };
}

/** A 1-D coast of `n` cells of width L/n with reserves given as [from, to) in km. */
export function coastHabitat(length: number, n: number, reserves: [number, number][], edge: EdgeKind = 'closed'): Habitat {
  const h = length / n;
  const row: MaskCode[] = Array.from({ length: n }, (_, i) => {
    const mid = (i + 0.5) * h;
    return reserves.some(([a, b]) => mid >= a && mid < b) ? 2 : 1;
  });
  return habitatFromMask([row], h, edge);
}

/** Reserve area (km² on a grid, km on a coast) and habitat area. */
export function areas(hab: Habitat): { reserve: number; total: number } {
  const unit = hab.ny > 1 ? hab.h * hab.h : hab.h;
  let res = 0;
  for (let i = 0; i < hab.reserve.length; i++) res += hab.reserve[i]!;
  return { reserve: res * unit, total: hab.cells.length * unit };
}

/** Area of one cell: km² on a grid, km on a coast. */
export function cellArea(hab: Habitat): number {
  return hab.ny > 1 ? hab.h * hab.h : hab.h;
}

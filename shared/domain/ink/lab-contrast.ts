/**
 * The ink score in CIELAB for ink close in colour to the printed grid (blue on a blue grid, red on an orange one).
 * Paper, grid and ink are three colours; a faded or thin stroke mixes towards the paper, so each of ink and grid
 * is a segment from the paper colour to its full colour. A pixel scores its share of the way from paper to ink,
 * weighted by how much nearer it lies to the ink's segment than to the grid's (ΔE*ab). Not linear in RGB, so the
 * score per colour is a lookup table, filled on first use of each cell (a scan holds few distinct colours).
 */
import { type Lab, srgbToLab } from './cielab';

/** Index into the lookup table: 64 levels per channel (4 grey levels each). */
export function lutIndex(r: number, g: number, b: number): number {
  return ((r >> 2) << 12) | ((g >> 2) << 6) | (b >> 2);
}

/** Paper, grid and ink colours of one scan, as sRGB 0–255. */
export interface LabPalette {
  paper: readonly [number, number, number];
  grid: readonly [number, number, number];
  ink: readonly [number, number, number];
}

/** Smallest ΔE*ab that counts as a difference in the nearness weight (about twice scanner noise, common practice). */
const NEARNESS_FLOOR = 3;
// A stroke darker than the given ink colour is still full ink, up to this share beyond it.
const MAX_SHARE = 1.5;

interface Segment {
  from: Lab;
  dl: number;
  da: number;
  db: number;
  length2: number;
}

function segment(from: Lab, to: Lab): Segment {
  const dl = to.l - from.l;
  const da = to.a - from.a;
  const db = to.b - from.b;
  return { from, dl, da, db, length2: Math.max(1e-9, dl * dl + da * da + db * db) };
}

/** Share of the way along the segment (clamped to 0 … MAX_SHARE) and the distance from it, ΔE*ab. */
function alongAndAway(s: Segment, x: Lab): { share: number; away: number } {
  const pl = x.l - s.from.l;
  const pa = x.a - s.from.a;
  const pb = x.b - s.from.b;
  const share = Math.min(MAX_SHARE, Math.max(0, (pl * s.dl + pa * s.da + pb * s.db) / s.length2));
  return { share, away: Math.hypot(pl - share * s.dl, pa - share * s.da, pb - share * s.db) };
}

/** Score of one colour: its ink share, times how clearly it sits nearer the ink's segment than the grid's. */
export function labScorer(palette: LabPalette): (r: number, g: number, b: number) => number {
  const paper = srgbToLab(...palette.paper);
  const ink = segment(paper, srgbToLab(...palette.ink));
  const grid = segment(paper, srgbToLab(...palette.grid));
  return (r, g, b) => {
    const x = srgbToLab(r, g, b);
    const toInk = alongAndAway(ink, x);
    const toGrid = alongAndAway(grid, x);
    const nearness = (toGrid.away - toInk.away) / Math.max(NEARNESS_FLOOR, 0.5 * (toGrid.away + toInk.away));
    return toInk.share * Math.min(1, Math.max(0, nearness));
  };
}

/**
 * A lookup table of scores over 64 levels per channel (see lutIndex), divided by `fullScore` so full ink scores
 * about 1. Cells are NaN until first read through `readLut`.
 */
export interface LabLut {
  table: Float32Array;
  fill: (index: number) => number;
  /** Factor applied to the raw score (1 / the score of full ink). */
  scale: number;
}

export function createLabLut(palette: LabPalette): LabLut {
  const score = labScorer(palette);
  const table = new Float32Array(64 * 64 * 64).fill(NaN);
  const lut: LabLut = {
    table,
    scale: 1,
    fill: (index: number): number => {
      // The cell's centre colour (each cell spans 4 grey levels per channel).
      const r = ((index >> 12) & 63) * 4 + 1.5;
      const g = ((index >> 6) & 63) * 4 + 1.5;
      const b = (index & 63) * 4 + 1.5;
      const value = score(r, g, b) * lut.scale;
      table[index] = value;
      return value;
    },
  };
  return lut;
}

/** Multiplies every score of the table (filled cells now, the others when filled) by `factor`. */
export function rescaleLut(lut: LabLut, factor: number): void {
  lut.scale *= factor;
  const { table } = lut;
  for (let i = 0; i < table.length; i++) if (table[i] === table[i]) table[i] *= factor;
}

/** Score of a colour from the table, filling its cell on first use. */
export function readLut(lut: LabLut, r: number, g: number, b: number): number {
  const index = lutIndex(r, g, b);
  const value = lut.table[index];
  return value === value ? value : lut.fill(index);
}

import type { RacewayKind } from '../model/schema';

/**
 * Internal area of conduit and tubing by kind and trade size: NFPA 70-2023 /
 * 2020 Chapter 9 Table 4 (the 100 % column and the 40 % column, in²), with
 * the nominal internal diameter the areas come from.
 *
 * Source: from memory, checked value by value against a public transcription
 * of the table (EMT and RMC also against textbook reproductions) for trade
 * sizes 1/2 to 4. Trade sizes 5 and 6 of RMC and PVC (Schedules 40 and 80)
 * are from memory only, held to the geometry check below. EMT and IMC stop
 * at trade size 4, the largest their articles permit (358.20(B), 342.20(B)),
 * so a run that needs more is flagged rather than sized.
 * Independent checks (test/core/tables/chapter9.test.ts): π/4 × ID² gives the
 * 100 % area within 0.0005 in²; the 40 % column is 0.40 × the 100 % area
 * rounded to 0.001 in².
 */
export const CHAPTER9_TABLE4_SOURCE = 'NFPA 70-2023 / 2020 Chapter 9 Table 4, trade sizes 1/2–4 from memory, checked against a public transcription; RMC and PVC 5 and 6 from memory, checked by π/4 × ID²';

export const TRADE_SIZES = ['1/2', '3/4', '1', '1-1/4', '1-1/2', '2', '2-1/2', '3', '3-1/2', '4', '5', '6'] as const;
export type TradeSize = (typeof TRADE_SIZES)[number];

export interface Table4Row {
  tradeSize: TradeSize;
  /** Nominal internal diameter, in. */
  idIn: number;
  /** Total internal area (100 %), in². */
  areaIn2: number;
  /** The table's 40 % column, in². */
  area40In2: number;
}

type Triple = readonly [idIn: number, areaIn2: number, area40In2: number];

function rows(values: readonly Triple[]): readonly Table4Row[] {
  return Object.freeze(values.map(([idIn, areaIn2, area40In2], i) => Object.freeze({ tradeSize: TRADE_SIZES[i]!, idIn, areaIn2, area40In2 })));
}

export const CHAPTER9_TABLE4: Readonly<Record<RacewayKind, readonly Table4Row[]>> = Object.freeze({
  // Article 358, electrical metallic tubing.
  EMT: rows([
    [0.622, 0.304, 0.122], [0.824, 0.533, 0.213], [1.049, 0.864, 0.346], [1.38, 1.496, 0.598], [1.61, 2.036, 0.814],
    [2.067, 3.356, 1.342], [2.731, 5.858, 2.343], [3.356, 8.846, 3.538], [3.834, 11.545, 4.618], [4.334, 14.753, 5.901],
  ]),
  // Article 342, intermediate metal conduit.
  IMC: rows([
    [0.66, 0.342, 0.137], [0.864, 0.586, 0.235], [1.105, 0.959, 0.384], [1.448, 1.647, 0.659], [1.683, 2.225, 0.89],
    [2.15, 3.63, 1.452], [2.557, 5.135, 2.054], [3.176, 7.922, 3.169], [3.671, 10.584, 4.234], [4.166, 13.631, 5.452],
  ]),
  // Article 344, rigid metal conduit (steel or aluminum).
  RMC: rows([
    [0.632, 0.314, 0.125], [0.836, 0.549, 0.22], [1.063, 0.887, 0.355], [1.394, 1.526, 0.61], [1.624, 2.071, 0.829],
    [2.083, 3.408, 1.363], [2.489, 4.866, 1.946], [3.09, 7.499, 3.0], [3.57, 10.01, 4.004], [4.05, 12.882, 5.153],
    [5.073, 20.212, 8.085], [6.093, 29.158, 11.663],
  ]),
  // Article 352, rigid PVC conduit, Schedule 40 (and Article 353 HDPE).
  'PVC-40': rows([
    [0.602, 0.285, 0.114], [0.804, 0.508, 0.203], [1.029, 0.832, 0.333], [1.36, 1.453, 0.581], [1.59, 1.986, 0.794],
    [2.047, 3.291, 1.316], [2.445, 4.695, 1.878], [3.042, 7.268, 2.907], [3.521, 9.737, 3.895], [3.998, 12.554, 5.022],
    [5.016, 19.761, 7.904], [6.031, 28.567, 11.427],
  ]),
  // Article 352, rigid PVC conduit, Schedule 80.
  'PVC-80': rows([
    [0.526, 0.217, 0.087], [0.722, 0.409, 0.164], [0.936, 0.688, 0.275], [1.255, 1.237, 0.495], [1.476, 1.711, 0.684],
    [1.913, 2.874, 1.15], [2.29, 4.119, 1.647], [2.864, 6.442, 2.577], [3.326, 8.688, 3.475], [3.786, 11.258, 4.503],
    [4.768, 17.855, 7.142], [5.709, 25.598, 10.239],
  ]),
});

/** Allowed fill area of one trade size for a fill fraction (Table 1): the 40 % column when it applies, else fraction × 100 %. */
export function allowedFillIn2(row: Table4Row, fraction: number): number {
  return fraction === 0.4 ? row.area40In2 : row.areaIn2 * fraction;
}

/** Trade-size label as an estimator writes it: '1-1/4"'. */
export function tradeSizeLabel(size: TradeSize): string {
  return `${size}"`;
}

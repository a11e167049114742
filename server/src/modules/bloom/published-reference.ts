// The published reference data Pollenpact starts from, each row labelled with its source:
// apple stage thresholds in degree days (TRADE.md §4) and critical bud temperatures
// (TRADE.md §6). Inserted by migration 0004 and again by the demo seed after it empties
// the tables; rows already there (perhaps edited) are left alone.
import type { Sequelize } from 'sequelize';
import { insertReferenceRows } from './bloom.queries.js';

export const CORNELL = 'Cornell / UMass fruit newsletters (apple, base 43 °F from March 1): published range';
export const BLOOM_NOTE = 'Interpolated between the published pink and petal-fall ranges (from memory; no single published value): check locally';
export const WSU = 'WSU Extension (EB0913 apple, EB0978 pear, EB1128 sweet cherry), as republished by Penn State Extension "Orchard Frost – Critical Temperatures for Various Fruits"';

// crop, stage label, stage key (matching a degree-day stage, when one does), 10% kill °F, 90% kill °F
export const frostRows: Array<[string, string, string | null, number, number]> = [
  ['apple', 'Silver tip', null, 15, 2],
  ['apple', 'Green tip', 'green-tip', 18, 10],
  ['apple', 'Half-inch green', null, 23, 15],
  ['apple', 'Tight cluster', null, 27, 21],
  ['apple', 'First pink', 'pink', 28, 24],
  ['apple', 'Full pink to full bloom', 'bloom', 28, 25],
  ['apple', 'Post bloom', 'petal-fall', 28, 25],
  ['pear', 'Scales separating', null, 15, 0],
  ['pear', 'Blossom buds exposed', null, 20, 6],
  ['pear', 'Tight cluster', null, 24, 15],
  ['pear', 'First white', null, 25, 19],
  ['pear', 'Full white', 'pink', 26, 22],
  ['pear', 'First bloom', 'bloom', 27, 23],
  ['pear', 'Full bloom', null, 28, 24],
  ['pear', 'Post bloom', 'petal-fall', 28, 24],
  ['sweet-cherry', 'First swelling', null, 17, 5],
  ['sweet-cherry', 'Side green', null, 22, 9],
  ['sweet-cherry', 'Green tip', 'green-tip', 25, 14],
  ['sweet-cherry', 'Tight cluster', null, 26, 17],
  ['sweet-cherry', 'Open cluster', null, 27, 21],
  ['sweet-cherry', 'First white', 'pink', 27, 24],
  ['sweet-cherry', 'First bloom', 'bloom', 28, 25],
  ['sweet-cherry', 'Full bloom', null, 28, 25],
  ['sweet-cherry', 'Post bloom', 'petal-fall', 28, 25],
];

// crop, stage key, label, order, base °F, low and high end (DD°F), source
export const stageRows: Array<[string, string, string, number, number, number, number, string]> = [
  ['apple', 'green-tip', 'Green tip', 1, 43, 100, 120, CORNELL],
  ['apple', 'pink', 'Pink', 2, 43, 267, 316, CORNELL],
  ['apple', 'bloom', 'Bloom', 3, 43, 330, 400, BLOOM_NOTE],
  ['apple', 'petal-fall', 'Petal fall', 4, 43, 439, 523, CORNELL],
];

export function insertPublishedReference(sequelize: Sequelize): Promise<void> {
  return insertReferenceRows(sequelize, stageRows, frostRows, WSU);
}

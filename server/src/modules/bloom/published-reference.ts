// The published reference data Pollenpact starts from, each row labelled with its source:
// stage thresholds in degree days for apple (Cornell / UMass fruit newsletters, base 43 °F
// from March 1; the stages between the published ones are from memory, labelled so), pear
// and sweet cherry (stage order from WSU Extension EB0978 / EB1128; degree days common
// practice, no source), and critical bud temperatures (WSU Extension EB0913 apple, EB0978
// pear, EB1128 sweet cherry, as republished by Penn State Extension "Orchard Frost –
// Critical Temperatures for Various Fruits"). Inserted by migrations 0004 and 0011 and
// again by the demo seed after it empties the tables; rows already there (perhaps edited)
// are left alone.
import type { Sequelize } from 'sequelize';
import { insertReferenceRows } from './bloom.queries.js';

export const CORNELL = 'Cornell / UMass fruit newsletters (apple, base 43 °F from March 1): published range';
export const BLOOM_NOTE = 'Interpolated between the published pink and petal-fall ranges (from memory; no single published value): check locally';
export const APPLE_BEFORE_GREEN_TIP = 'Before the published green-tip range (from memory; no single published value): check locally';
export const APPLE_BEFORE_PINK = 'Between the published green-tip and pink ranges (from memory; no single published value): check locally';
export const PEAR_CHERRY_NOTE = 'Stage order as in WSU Extension EB0978 (pear) / EB1128 (sweet cherry); degree days base 43 °F from March 1 from memory (no single published table): check locally';
export const WSU = 'WSU Extension (EB0913 apple, EB0978 pear, EB1128 sweet cherry), as republished by Penn State Extension "Orchard Frost – Critical Temperatures for Various Fruits"';

// crop, stage label, stage key (the degree-day stage it belongs to), 10% kill °F, 90% kill °F.
// Every row has its own stage, so every row can be reached by a block's degree days.
export const frostRows: Array<[string, string, string, number, number]> = [
  ['apple', 'Silver tip', 'silver-tip', 15, 2],
  ['apple', 'Green tip', 'green-tip', 18, 10],
  ['apple', 'Half-inch green', 'half-inch-green', 23, 15],
  ['apple', 'Tight cluster', 'tight-cluster', 27, 21],
  ['apple', 'First pink', 'pink', 28, 24],
  ['apple', 'Full pink to full bloom', 'bloom', 28, 25],
  ['apple', 'Post bloom', 'petal-fall', 28, 25],
  ['pear', 'Scales separating', 'scales-separating', 15, 0],
  ['pear', 'Blossom buds exposed', 'blossom-buds-exposed', 20, 6],
  ['pear', 'Tight cluster', 'tight-cluster', 24, 15],
  ['pear', 'First white', 'first-white', 25, 19],
  ['pear', 'Full white', 'full-white', 26, 22],
  ['pear', 'First bloom', 'bloom', 27, 23],
  ['pear', 'Full bloom', 'full-bloom', 28, 24],
  ['pear', 'Post bloom', 'petal-fall', 28, 24],
  ['sweet-cherry', 'First swelling', 'first-swelling', 17, 5],
  ['sweet-cherry', 'Side green', 'side-green', 22, 9],
  ['sweet-cherry', 'Green tip', 'green-tip', 25, 14],
  ['sweet-cherry', 'Tight cluster', 'tight-cluster', 26, 17],
  ['sweet-cherry', 'Open cluster', 'open-cluster', 27, 21],
  ['sweet-cherry', 'First white', 'first-white', 27, 24],
  ['sweet-cherry', 'First bloom', 'bloom', 28, 25],
  ['sweet-cherry', 'Full bloom', 'full-bloom', 28, 25],
  ['sweet-cherry', 'Post bloom', 'petal-fall', 28, 25],
];

// crop, stage key, label, order, base °F, low and high end (DD°F), source. Each crop with
// published critical temperatures has a stage for every row of its table; where no
// published degree-day value exists the row says so (from memory, check locally).
export const stageRows: Array<[string, string, string, number, number, number, number, string]> = [
  ['apple', 'silver-tip', 'Silver tip', 0, 43, 50, 90, APPLE_BEFORE_GREEN_TIP],
  ['apple', 'green-tip', 'Green tip', 1, 43, 100, 120, CORNELL],
  ['apple', 'half-inch-green', 'Half-inch green', 2, 43, 140, 190, APPLE_BEFORE_PINK],
  ['apple', 'tight-cluster', 'Tight cluster', 3, 43, 200, 260, APPLE_BEFORE_PINK],
  ['apple', 'pink', 'Pink', 4, 43, 267, 316, CORNELL],
  ['apple', 'bloom', 'Bloom', 5, 43, 330, 400, BLOOM_NOTE],
  ['apple', 'petal-fall', 'Petal fall', 6, 43, 439, 523, CORNELL],
  ['pear', 'scales-separating', 'Scales separating', 0, 43, 40, 80, PEAR_CHERRY_NOTE],
  ['pear', 'blossom-buds-exposed', 'Blossom buds exposed', 1, 43, 90, 130, PEAR_CHERRY_NOTE],
  ['pear', 'tight-cluster', 'Tight cluster', 2, 43, 140, 190, PEAR_CHERRY_NOTE],
  ['pear', 'first-white', 'First white', 3, 43, 200, 240, PEAR_CHERRY_NOTE],
  ['pear', 'full-white', 'Full white', 4, 43, 245, 280, PEAR_CHERRY_NOTE],
  ['pear', 'bloom', 'First bloom', 5, 43, 285, 320, PEAR_CHERRY_NOTE],
  ['pear', 'full-bloom', 'Full bloom', 6, 43, 325, 370, PEAR_CHERRY_NOTE],
  ['pear', 'petal-fall', 'Petal fall', 7, 43, 400, 480, PEAR_CHERRY_NOTE],
  ['sweet-cherry', 'first-swelling', 'First swelling', 0, 43, 30, 70, PEAR_CHERRY_NOTE],
  ['sweet-cherry', 'side-green', 'Side green', 1, 43, 80, 110, PEAR_CHERRY_NOTE],
  ['sweet-cherry', 'green-tip', 'Green tip', 2, 43, 115, 150, PEAR_CHERRY_NOTE],
  ['sweet-cherry', 'tight-cluster', 'Tight cluster', 3, 43, 155, 190, PEAR_CHERRY_NOTE],
  ['sweet-cherry', 'open-cluster', 'Open cluster', 4, 43, 195, 230, PEAR_CHERRY_NOTE],
  ['sweet-cherry', 'first-white', 'First white', 5, 43, 235, 270, PEAR_CHERRY_NOTE],
  ['sweet-cherry', 'bloom', 'First bloom', 6, 43, 275, 310, PEAR_CHERRY_NOTE],
  ['sweet-cherry', 'full-bloom', 'Full bloom', 7, 43, 315, 350, PEAR_CHERRY_NOTE],
  ['sweet-cherry', 'petal-fall', 'Petal fall', 8, 43, 380, 450, PEAR_CHERRY_NOTE],
];

export function insertPublishedReference(sequelize: Sequelize): Promise<void> {
  return insertReferenceRows(sequelize, stageRows, frostRows, WSU);
}

// The crops Pollenpact knows, with the default stocking rate (colonies per acre) and the
// default minimum colony strength (frames of bees) a request starts from, each with its
// source named beside it (stockingSource, minFramesSource; where none is published:
// common practice, no source). Growers may set other values per block/request.

export const cropKeys = [
  'almond', 'apple', 'pear', 'sweet-cherry', 'plum', 'peach', 'highbush-blueberry',
  'cranberry', 'cucumber', 'muskmelon', 'squash', 'watermelon',
] as const;
export type CropKey = (typeof cropKeys)[number];

export interface CropInfo {
  key: CropKey;
  label: string;
  /** Published colonies-per-acre range; `typical` is the default a new block gets. */
  coloniesPerAcre: { min: number; max: number; typical: number };
  stockingNote: string | null;
  stockingSource: string;
  /** Default minimum frames of bees per colony for a request. */
  minFramesOfBees: number;
  minFramesSource: string;
}

const MSU_TABLE = 'Michigan State Univ. Extension 2014, stocking table from Delaplane & Mayer (2000), Crop Pollination by Bees';
const PAM = 'Project Apis m. best-practice summary (Good Fruit Grower)';
const FRAMES_RULE_OF_THUMB = 'Common practice, no source (6 frames of bees)';

export const crops: readonly CropInfo[] = [
  {
    key: 'almond', label: 'Almond', coloniesPerAcre: { min: 2, max: 2, typical: 2 }, stockingNote: 'colonies averaging 8 frames of bees, 6 minimum',
    stockingSource: 'Almond Board of California, Honey Bee Best Management Practices for California Almonds',
    minFramesOfBees: 6, minFramesSource: 'Almond Board of California, Honey Bee Best Management Practices (average 8, minimum 6 frames of bees)',
  },
  {
    key: 'apple', label: 'Apple', coloniesPerAcre: { min: 1, max: 2, typical: 1.5 },
    stockingNote: 'up to 2.5 in high-density plantings; 5 where there are no native pollinators',
    stockingSource: `${PAM}; Canadian Honey Council, Managing Bees for Pollination`,
    minFramesOfBees: 6, minFramesSource: 'Delaplane & Mayer 2000, Crop Pollination by Bees, ch. 17 (6 frames of brood covered by bees, about 20,000 bees)',
  },
  { key: 'pear', label: 'Pear', coloniesPerAcre: { min: 2, max: 4, typical: 2 }, stockingNote: null, stockingSource: PAM, minFramesOfBees: 6, minFramesSource: FRAMES_RULE_OF_THUMB },
  { key: 'sweet-cherry', label: 'Sweet cherry', coloniesPerAcre: { min: 2, max: 5, typical: 3 }, stockingNote: 'cultivar-dependent', stockingSource: PAM, minFramesOfBees: 6, minFramesSource: FRAMES_RULE_OF_THUMB },
  { key: 'plum', label: 'Plum / prune', coloniesPerAcre: { min: 1, max: 2, typical: 1.3 }, stockingNote: 'average 1.3', stockingSource: MSU_TABLE, minFramesOfBees: 6, minFramesSource: FRAMES_RULE_OF_THUMB },
  { key: 'peach', label: 'Peach / nectarine / apricot', coloniesPerAcre: { min: 0.08, max: 2, typical: 0.8 }, stockingNote: 'average 0.8', stockingSource: MSU_TABLE, minFramesOfBees: 6, minFramesSource: FRAMES_RULE_OF_THUMB },
  {
    key: 'highbush-blueberry', label: 'Highbush blueberry', coloniesPerAcre: { min: 4, max: 4, typical: 4 }, stockingNote: 'long-standing recommendation',
    stockingSource: 'Washington State Univ. (DeVetter); Oregon Blueberry Commission reports', minFramesOfBees: 6, minFramesSource: FRAMES_RULE_OF_THUMB,
  },
  {
    key: 'cranberry', label: 'Cranberry', coloniesPerAcre: { min: 2, max: 3, typical: 2 }, stockingNote: 'Wisconsin survey 2005 average 1.8',
    stockingSource: 'Univ. of Wisconsin–Madison entomology', minFramesOfBees: 6, minFramesSource: FRAMES_RULE_OF_THUMB,
  },
  {
    key: 'cucumber', label: 'Cucumber', coloniesPerAcre: { min: 0.1, max: 4, typical: 1 }, stockingNote: 'NC State recommends 1; MSU range 0.1–4, average 2.2',
    stockingSource: `NC State Beekeeping Insect Note 7B; ${MSU_TABLE}`, minFramesOfBees: 6, minFramesSource: FRAMES_RULE_OF_THUMB,
  },
  { key: 'muskmelon', label: 'Muskmelon / cantaloupe', coloniesPerAcre: { min: 0.2, max: 5, typical: 1.8 }, stockingNote: 'average 1.8', stockingSource: MSU_TABLE, minFramesOfBees: 6, minFramesSource: FRAMES_RULE_OF_THUMB },
  { key: 'squash', label: 'Squash / pumpkin', coloniesPerAcre: { min: 0.04, max: 3, typical: 1.5 }, stockingNote: 'average 1.5', stockingSource: MSU_TABLE, minFramesOfBees: 6, minFramesSource: FRAMES_RULE_OF_THUMB },
  {
    key: 'watermelon', label: 'Watermelon', coloniesPerAcre: { min: 1, max: 1, typical: 1 }, stockingNote: 'seedless: at least 1 strong colony per acre',
    stockingSource: 'Adlerz 1966, J. Econ. Entomol. 59:28–30; Clemson Extension', minFramesOfBees: 6, minFramesSource: FRAMES_RULE_OF_THUMB,
  },
];

export function cropInfo(key: string): CropInfo | undefined {
  return crops.find((c) => c.key === key);
}

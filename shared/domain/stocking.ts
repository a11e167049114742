// Stocking: how many colonies a block needs. Colonies needed = acres x colonies per acre,
// rounded up to whole colonies (common practice, no source).

export function coloniesNeeded(acres: number, coloniesPerAcre: number): number {
  if (!(acres >= 0) || !(coloniesPerAcre >= 0)) throw new RangeError('acres and colonies per acre must be zero or more');
  // Round to a millionth of a colony first, so floating-point noise (10 acres x 2.2 =
  // 22.000000000000004) and acres typed to seven places (12.3333334 x 3 = 37.0000002) do
  // not ask for one colony more. The block page and the season overview both use this.
  return Math.ceil(Number((acres * coloniesPerAcre).toFixed(6)));
}

export type StockingAdvice = 'below-range' | 'within-range' | 'above-range';

/** Where a chosen rate sits against a crop's published range. */
export function stockingAdvice(coloniesPerAcre: number, range: { min: number; max: number }): StockingAdvice {
  if (coloniesPerAcre < range.min) return 'below-range';
  if (coloniesPerAcre > range.max) return 'above-range';
  return 'within-range';
}

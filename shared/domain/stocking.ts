// Stocking: how many colonies a block needs. Colonies needed = acres x colonies per acre,
// rounded up to whole colonies (TRADE.md §1).

export function coloniesNeeded(acres: number, coloniesPerAcre: number): number {
  if (!(acres >= 0) || !(coloniesPerAcre >= 0)) throw new RangeError('acres and colonies per acre must be zero or more');
  // Round away floating-point noise first so 10 acres x 2.2 is 22, not 23.
  return Math.ceil(Number((acres * coloniesPerAcre).toFixed(9)));
}

export type StockingAdvice = 'below-range' | 'within-range' | 'above-range';

/** Where a chosen rate sits against a crop's published range. */
export function stockingAdvice(coloniesPerAcre: number, range: { min: number; max: number }): StockingAdvice {
  if (coloniesPerAcre < range.min) return 'below-range';
  if (coloniesPerAcre > range.max) return 'above-range';
  return 'within-range';
}

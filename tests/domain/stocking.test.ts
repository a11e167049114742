// Colonies needed for a block and the crop stocking defaults.
import { describe, it, expect } from 'vitest';
import { coloniesNeeded, stockingAdvice } from '../../shared/domain/stocking.js';
import { crops, cropInfo } from '../../shared/domain/crops.js';

describe('coloniesNeeded', () => {
  it('is acres x colonies per acre, rounded up to whole colonies', () => {
    // Colonies needed = acres x rate, rounded up (common practice, no source).
    expect(coloniesNeeded(20, 2)).toBe(40);
    expect(coloniesNeeded(20.1, 2)).toBe(41);
    expect(coloniesNeeded(10, 2.2)).toBe(22); // no floating-point overshoot
    // 12.3333334 acres (12⅓ typed to seven places) x 3 = 37.0000002: 37, rounded to a millionth of a colony
    // first (common practice, no source), the same on the block page and the season overview.
    expect(coloniesNeeded(12.3333334, 3)).toBe(37);
    expect(coloniesNeeded(12.334, 3)).toBe(38); // 37.002 is a real shortfall
    expect(coloniesNeeded(0.3, 1)).toBe(1);
    expect(coloniesNeeded(0, 2)).toBe(0);
  });

  it('refuses negative inputs', () => {
    expect(() => coloniesNeeded(-1, 2)).toThrow(RangeError);
  });
});

describe('crop stocking defaults', () => {
  it('almond is 2 colonies per acre', () => {
    // Source: Almond Board of California, Honey Bee Best Management Practices for California Almonds.
    expect(cropInfo('almond')!.coloniesPerAcre).toMatchObject({ min: 2, max: 2, typical: 2 });
    expect(cropInfo('almond')!.minFramesOfBees).toBe(6);
  });

  it('apple is 1–2 colonies per acre with 6 frames minimum', () => {
    // Source: Project Apis m. best-practice summary (Good Fruit Grower); Delaplane & Mayer 2000, ch. 17.
    expect(cropInfo('apple')!.coloniesPerAcre).toMatchObject({ min: 1, max: 2 });
    expect(cropInfo('apple')!.minFramesOfBees).toBe(6);
  });

  it('pear 2–4, sweet cherry 2–5, blueberry 4, peach 0.08–2', () => {
    // Source: Project Apis m. (pear, cherry); WSU DeVetter (blueberry); MSU Extension 2014 table (peach).
    expect(cropInfo('pear')!.coloniesPerAcre).toMatchObject({ min: 2, max: 4 });
    expect(cropInfo('sweet-cherry')!.coloniesPerAcre).toMatchObject({ min: 2, max: 5 });
    expect(cropInfo('highbush-blueberry')!.coloniesPerAcre).toMatchObject({ min: 4, max: 4 });
    expect(cropInfo('peach')!.coloniesPerAcre).toMatchObject({ min: 0.08, max: 2, typical: 0.8 });
  });

  it('every crop has a source and a typical rate inside its range', () => {
    for (const crop of crops) {
      expect(crop.stockingSource.length).toBeGreaterThan(10);
      expect(crop.coloniesPerAcre.typical).toBeGreaterThanOrEqual(crop.coloniesPerAcre.min);
      expect(crop.coloniesPerAcre.typical).toBeLessThanOrEqual(crop.coloniesPerAcre.max);
    }
  });

  it('warns outside the range, at both edges', () => {
    const range = { min: 1, max: 2 };
    expect(stockingAdvice(0.99, range)).toBe('below-range');
    expect(stockingAdvice(1, range)).toBe('within-range');
    expect(stockingAdvice(2, range)).toBe('within-range');
    expect(stockingAdvice(2.01, range)).toBe('above-range');
  });
});

// Bee toxicity categories and extended residual toxicity.
// Source: EPA, Ecological Effects Test Guidelines OCSPP 850.3020 Honey Bee Acute Contact Toxicity (EPA 2012),
// categories after Atkins, Kellum & Atkins 1981 (highly toxic 0.001–1.99, moderately toxic 2.0–10.99,
// practically nontoxic >= 11 µg/bee). RT25 over 8 h = extended residual toxicity (EPA label practice; a rule, rating B).
import { describe, it, expect } from 'vitest';
import { beeToxicityClass, hasExtendedResidualToxicity, productBeeHazard, ASSUMED_RESIDUAL_HOURS } from '../../shared/domain/bee-toxicity.js';

describe('beeToxicityClass', () => {
  it('puts LD50 just under 2 µg/bee in highly toxic and exactly 2.0 in moderately toxic', () => {
    expect(beeToxicityClass(1.99)).toBe('highly-toxic');
    expect(beeToxicityClass(2.0)).toBe('moderately-toxic');
    expect(beeToxicityClass(0.001)).toBe('highly-toxic');
  });

  it('puts LD50 just under 11 µg/bee in moderately toxic and exactly 11 in practically nontoxic', () => {
    expect(beeToxicityClass(10.99)).toBe('moderately-toxic');
    expect(beeToxicityClass(11)).toBe('practically-nontoxic');
    expect(beeToxicityClass(100)).toBe('practically-nontoxic');
  });

  it('refuses a negative or non-numeric LD50', () => {
    expect(() => beeToxicityClass(-1)).toThrow(RangeError);
    expect(() => beeToxicityClass(Number.NaN)).toThrow(RangeError);
  });
});

describe('hasExtendedResidualToxicity', () => {
  it('counts RT25 over 8 hours as extended and exactly 8 hours as not', () => {
    expect(hasExtendedResidualToxicity(8)).toBe(false);
    expect(hasExtendedResidualToxicity(8.01)).toBe(true);
    expect(hasExtendedResidualToxicity(2)).toBe(false);
  });
});

describe('productBeeHazard', () => {
  it('treats a product without label data as highly toxic with extended residual toxicity', () => {
    const hazard = productBeeHazard({ ld50UgPerBee: null, rt25Hours: null });
    expect(hazard).toMatchObject({ toxicityClass: 'highly-toxic', acutelyToxic: true, extendedResidual: true, assumed: { ld50: true, rt25: true } });
    expect(hazard.residualHours).toBe(ASSUMED_RESIDUAL_HOURS);
    expect(hazard.residualHours).toBeGreaterThan(8);
  });

  it('uses the entered label data: LD50 11 is not acutely toxic (EPA 2017 policy: acutely toxic = LD50 < 11), RT25 as residual', () => {
    expect(productBeeHazard({ ld50UgPerBee: 11, rt25Hours: 3 })).toMatchObject({ acutelyToxic: false, extendedResidual: false, residualHours: 3 });
    expect(productBeeHazard({ ld50UgPerBee: 10.99, rt25Hours: 9 })).toMatchObject({ acutelyToxic: true, extendedResidual: true, residualHours: 9 });
  });
});

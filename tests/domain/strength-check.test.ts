// Strength checks: the sample-size rule and the group's averages against worked numbers.
// Source for the rule: Pennsylvania Department of Agriculture colony strength program and
// Rutgers NJ Agricultural Experiment Station recommendations (open a random sample of at
// least 10% of the colonies; colonies below minimum may be offset by those above); a
// published rule of thumb. The worked numbers below are computed by hand.
import { describe, it, expect } from 'vitest';
import { minimumSampleSize, summarizeStrength, defaultMinimumStrength } from '../../shared/domain/strength-check.js';

describe('minimumSampleSize', () => {
  it('opens at least 10% of the colonies, rounded up (PDA program; Rutgers)', () => {
    expect(minimumSampleSize(40)).toBe(4); // 10% of 40 = 4
    expect(minimumSampleSize(44)).toBe(5); // 4.4 rounded up
    expect(minimumSampleSize(30)).toBe(3); // exactly 3, not 4 from floating-point noise
    expect(minimumSampleSize(101)).toBe(11); // 10.1 rounded up
    expect(minimumSampleSize(9)).toBe(1); // never fewer than one colony
  });

  it('refuses a group without colonies', () => {
    expect(() => minimumSampleSize(0)).toThrow(RangeError);
    expect(() => minimumSampleSize(2.5)).toThrow(RangeError);
  });
});

describe('summarizeStrength', () => {
  it('passes a group whose weak colony is offset by strong ones (Rutgers rule; worked by hand)', () => {
    // 50 colonies, 5 opened (10%): 8, 7, 5, 6, 9 frames of bees against a minimum of 6.
    // Average 35 / 5 = 7; one colony below (5): 1 frame short; 2 + 1 + 3 = 6 frames over.
    const s = summarizeStrength({ coloniesInGroup: 50, framesOfBees: [8, 7, 5, 6, 9], minFramesOfBees: 6 });
    expect(s.requiredSample).toBe(5);
    expect(s.averageFramesOfBees).toBe(7);
    expect(s.belowMinimumCount).toBe(1);
    expect(s.belowMinimumShare).toBeCloseTo(0.2, 10);
    expect(s.framesShort).toBe(1);
    expect(s.framesOver).toBe(6);
    expect(s.meetsAgreement).toBe(true);
  });

  it('fails a group whose shortfall is not made up (worked by hand)', () => {
    // 40 colonies, 4 opened: 4, 5, 6, 7 against 6: average 5.5; short 2 + 1 = 3, over 1.
    const s = summarizeStrength({ coloniesInGroup: 40, framesOfBees: [4, 5, 6, 7], minFramesOfBees: 6 });
    expect(s.averageFramesOfBees).toBe(5.5);
    expect(s.belowMinimumCount).toBe(2);
    expect(s.belowMinimumShare).toBe(0.5);
    expect(s.framesShort).toBe(3);
    expect(s.framesOver).toBe(1);
    expect(s.meetsAgreement).toBe(false);
  });

  it('meets the almond standard of an 8-frame average with a 6-frame minimum (Almond Board of California, Honey Bee BMPs)', () => {
    const s = summarizeStrength({ coloniesInGroup: 40, framesOfBees: [6, 8, 10, 8], minFramesOfBees: 6 });
    expect(s.averageFramesOfBees).toBe(8);
    expect(s.belowMinimumCount).toBe(0);
    expect(s.meetsAgreement).toBe(true);
  });

  it('does not pass a sample smaller than 10% however strong it is', () => {
    const s = summarizeStrength({ coloniesInGroup: 50, framesOfBees: [12, 12, 12, 12], minFramesOfBees: 6 });
    expect(s.sampleLargeEnough).toBe(false);
    expect(s.meetsAgreement).toBe(false);
  });

  it('checks the average frames of brood when a brood minimum is agreed', () => {
    const ok = summarizeStrength({ coloniesInGroup: 20, framesOfBees: [8, 8], minFramesOfBees: 6, framesOfBrood: [5, 7], minFramesOfBrood: 6 });
    expect(ok.averageFramesOfBrood).toBe(6);
    expect(ok.meetsBroodMinimum).toBe(true);
    const short = summarizeStrength({ coloniesInGroup: 20, framesOfBees: [8, 8], minFramesOfBees: 6, framesOfBrood: [4, 5], minFramesOfBrood: 6 });
    expect(short.meetsBroodMinimum).toBe(false);
    expect(short.meetsAgreement).toBe(false);
  });

  it('refuses negative frames', () => {
    expect(() => summarizeStrength({ coloniesInGroup: 10, framesOfBees: [-1], minFramesOfBees: 6 })).toThrow(RangeError);
  });

  it('starts apple requests at 6 frames of brood (Delaplane & Mayer 2000, Crop Pollination by Bees, ch. 17)', () => {
    expect(defaultMinimumStrength('apple').framesOfBrood).toBe(6);
    expect(defaultMinimumStrength('almond').framesOfBees).toBe(6); // Almond Board: 6 frames minimum
  });
});

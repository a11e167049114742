// Stage prediction from accumulated degree days (frost risk: frost.test.ts).
import { describe, it, expect } from 'vitest';
import { accumulateDegreeDays } from '../../shared/domain/degree-days.js';
import { predictStages, currentStage, suggestBloomWindow } from '../../shared/domain/bloom-forecast.js';

// Source: Cornell / UMass fruit newsletters: apple base 43 °F from March 1,
// green tip about 100–120 DD, pink 267–316, petal fall about 439–523. Bloom 330–400 is our
// interpolation between pink and petal fall (from memory, not a published range).
const apple = [
  { stage: 'green-tip', label: 'Green tip', ddLow: 100, ddHigh: 120 },
  { stage: 'pink', label: 'Pink', ddLow: 267, ddHigh: 316 },
  { stage: 'bloom', label: 'Bloom', ddLow: 330, ddHigh: 400 },
  { stage: 'petal-fall', label: 'Petal fall', ddLow: 439, ddHigh: 523 },
];

// 10 DD°F a day (min 43, max 63, average method) from March 1.
const days = Array.from({ length: 80 }, (_, i) => {
  const d = new Date(Date.UTC(2027, 2, 1 + i));
  return { day: d.toISOString().slice(0, 10), tmin: 43, tmax: 63, estimated: i >= 40 };
});
const series = accumulateDegreeDays(days, { lower: 43, upper: null, method: 'average', from: '2027-03-01' });

describe('predictStages', () => {
  it('dates each stage by the low, middle and high end of its range', () => {
    const [greenTip, pink, , petalFall] = predictStages(series, apple);
    expect(greenTip).toMatchObject({ earliest: '2027-03-10', expected: '2027-03-11', latest: '2027-03-12', estimated: false });
    expect(pink.earliest).toBe('2027-03-27'); // 270 >= 267 on day 27
    expect(petalFall).toMatchObject({ earliest: '2027-04-13', expected: '2027-04-18', latest: '2027-04-22', estimated: true });
  });

  it('leaves a stage undated when the data do not reach it', () => {
    const short = series.slice(0, 20);
    expect(predictStages(short, apple)[1]).toMatchObject({ earliest: null, expected: null, latest: null });
  });

  it('names the current stage at both edges of a threshold', () => {
    expect(currentStage(99.9, apple)).toBeNull();
    expect(currentStage(100, apple)?.stage).toBe('green-tip');
    expect(currentStage(266.9, apple)?.stage).toBe('green-tip');
    expect(currentStage(267, apple)?.stage).toBe('pink');
  });

  it('suggests a bloom window in order: start <= full bloom <= petal fall', () => {
    const window = suggestBloomWindow(predictStages(series, apple))!;
    expect(window).toEqual({ bloomStart: '2027-04-02', fullBloom: '2027-04-09', petalFall: '2027-04-18' });
  });
});

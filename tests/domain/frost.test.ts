// Frost risk at every stage: the published critical bud temperatures, a stage path that
// reaches every row of each crop's table, and a low at the critical value counting.
import { describe, it, expect } from 'vitest';
import { frostRisk, worstFrost } from '../../shared/domain/frost.js';
import { currentStage, type StageThreshold } from '../../shared/domain/bloom-forecast.js';
import { fahrenheitToCelsius } from '../../shared/domain/units.js';
import { frostRows, stageRows } from '../../server/src/modules/bloom/published-reference.js';

const critical = (kill10F: number, kill90F: number) => ({ kill10C: fahrenheitToCelsius(kill10F), kill90C: fahrenheitToCelsius(kill90F) });
const stagesOf = (crop: string): StageThreshold[] =>
  stageRows.filter((r) => r[0] === crop).map(([, stage, label, , , ddLow, ddHigh]) => ({ stage, label, ddLow, ddHigh }));
const rowFor = (crop: string, cumulative: number) => {
  const stage = currentStage(cumulative, stagesOf(crop));
  return stage ? frostRows.find((r) => r[0] === crop && r[2] === stage.stage) ?? null : null;
};

describe('frostRisk', () => {
  // Source: WSU Extension EB0913 (apple, Red Delicious) via Penn State Extension "Orchard Frost – Critical
  // Temperatures for Various Fruits": full pink to full bloom 10% kill 28 °F, 90% kill 25 °F, held 30 minutes.
  const bloom = critical(28, 25);

  it('counts a low exactly at the 10% kill temperature as damage', () => {
    expect(frostRisk(fahrenheitToCelsius(28), bloom)).toBe('damage');
    expect(frostRisk(fahrenheitToCelsius(29), bloom)).toBe('none');
  });

  it('counts a low exactly at the 90% kill temperature as severe', () => {
    expect(frostRisk(fahrenheitToCelsius(25), bloom)).toBe('severe');
    expect(frostRisk(fahrenheitToCelsius(26), bloom)).toBe('damage');
  });

  it('matches a low stored in °C with a whole-°F table value (28 °F = -2.2222 °C)', () => {
    expect(frostRisk(-2.2222222, bloom)).toBe('damage');
    expect(frostRisk(-2.2, bloom)).toBe('none');
  });

  it('refuses a low that is not a number', () => {
    expect(() => frostRisk(Number.NaN, bloom)).toThrow(RangeError);
  });

  it('judges each low at its own day\'s stage: 28 °F spares tight cluster but damages first pink', () => {
    // Source: WSU Extension EB0913 (apple, Red Delicious) via Penn State Extension: tight cluster 27/21 °F,
    // first pink 28/24 °F.
    const tightCluster = critical(27, 21);
    const firstPink = critical(28, 24);
    const lows = [
      { day: '2027-04-02', lowC: fahrenheitToCelsius(28), critical: firstPink },
      { day: '2027-04-01', lowC: fahrenheitToCelsius(28), critical: tightCluster },
      { day: '2027-04-03', lowC: fahrenheitToCelsius(20), critical: null }, // no stage known that day
    ];
    expect(worstFrost(lows)).toMatchObject({ day: '2027-04-02', risk: 'damage', critical: firstPink });
    expect(worstFrost([...lows, { day: '2027-04-04', lowC: fahrenheitToCelsius(24), critical: firstPink }])).toMatchObject({ day: '2027-04-04', risk: 'severe' });
    expect(worstFrost(lows.slice(1))).toBeNull();
  });
});

describe('stage paths to the critical-temperature rows', () => {
  for (const crop of ['apple', 'pear', 'sweet-cherry']) {
    it(`reaches every ${crop} row, in the table's order, from degree days`, () => {
      const rows = frostRows.filter((r) => r[0] === crop);
      expect(rows.length).toBeGreaterThanOrEqual(7);
      const stages = stagesOf(crop).sort((a, b) => a.ddLow - b.ddLow);
      // One stage per row, in the published order (WSU EB0913 / EB0978 / EB1128 via Penn State Extension).
      expect(stages.map((s) => s.stage)).toEqual(rows.map((r) => r[2]));
      for (const s of stages) expect(rowFor(crop, s.ddLow)?.[2]).toBe(s.stage);
      // Every degree-day row names its source; unpublished values say "from memory".
      for (const r of stageRows.filter((x) => x[0] === crop)) expect(r[7]).toMatch(/Cornell|from memory/);
    });
  }

  it('warns of a 24 °F low at apple tight cluster (WSU: 10% kill 27 °F, 90% kill 21 °F)', () => {
    // Source: WSU Extension EB0913 via Penn State Extension; tight cluster lies between the published green-tip
    // (100–120 DD°F) and pink (267–316) ranges (Cornell / UMass), its own range from memory.
    const row = rowFor('apple', 230)!;
    expect(row.slice(1)).toEqual(['Tight cluster', 'tight-cluster', 27, 21]);
    expect(frostRisk(fahrenheitToCelsius(24), critical(row[3], row[4]))).toBe('damage');
    expect(rowFor('apple', 150)!.slice(1)).toEqual(['Half-inch green', 'half-inch-green', 23, 15]);
  });

  it('gives pear and sweet cherry blocks their own rows', () => {
    // Source: WSU Extension EB0978 (pear, Bartlett): first bloom 27/23 °F; EB1128 (sweet cherry): side green 22/9 °F.
    expect(rowFor('pear', 300)!.slice(1)).toEqual(['First bloom', 'bloom', 27, 23]);
    expect(rowFor('sweet-cherry', 90)!.slice(1)).toEqual(['Side green', 'side-green', 22, 9]);
    expect(rowFor('pear', 10)).toBeNull(); // before the first stage: dormant
  });
});

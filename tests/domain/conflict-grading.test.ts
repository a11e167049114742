// Grading a found overlap between a spray and colonies or bloom.
import { describe, it, expect } from 'vitest';
import { gradeConflict, conflictGrades, compareGrades, type FoundOverlap } from '../../shared/domain/conflict-grading.js';
import { productBeeHazard } from '../../shared/domain/bee-toxicity.js';

const base: FoundOverlap = {
  hazard: productBeeHazard({ ld50UgPerBee: 0.1, rt25Hours: 24 }),
  duringBloom: true,
  colonies: 40,
  distanceM: 0,
  bufferM: 1609.344,
  contractedOnSprayedBlock: true,
  presentDuringSpray: true,
  noticeGivenHours: 72,
  noticeAgreedHours: 48,
  hoursDuringBeeFlight: 0,
};

describe('gradeConflict', () => {
  it('lists our grades from most to least serious', () => {
    expect(conflictGrades).toEqual(['label-bar', 'colonies-exposed', 'bloom-spray', 'short-notice', 'flight-hours']);
    expect(compareGrades('label-bar', 'flight-hours')).toBeLessThan(0);
  });

  // Source: EPA, Policy to Mitigate the Acute Risk to Bees from Pesticide Products (January 2017):
  // acutely toxic (LD50 < 11 µg/bee) foliar application during bloom with contracted bees on site is not allowed on affected labels.
  it('bars an acutely toxic product during bloom with contracted colonies on the block', () => {
    const graded = gradeConflict(base)!;
    expect(graded.grade).toBe('label-bar');
    expect(graded.grades).toEqual(['label-bar', 'colonies-exposed']);
    expect(graded.reasons[0]).toMatch(/EPA's 2017 bee policy/);
  });

  it('does not bar a product with LD50 exactly 11 µg/bee (practically nontoxic) and grades nothing without other findings', () => {
    expect(gradeConflict({ ...base, hazard: productBeeHazard({ ld50UgPerBee: 11, rt25Hours: 2 }) })).toBeNull();
  });

  it('grades colonies within the buffer during the residue window when the block is not in bloom', () => {
    const graded = gradeConflict({ ...base, duringBloom: false, distanceM: 900, contractedOnSprayedBlock: false, presentDuringSpray: false })!;
    expect(graded.grade).toBe('colonies-exposed');
    expect(graded.reasons[0]).toMatch(/900 m from a sprayed block/);
  });

  it('says when the residue time is assumed for lack of an RT25', () => {
    const graded = gradeConflict({ ...base, hazard: productBeeHazard({ ld50UgPerBee: null, rt25Hours: null }), duringBloom: false })!;
    expect(graded.reasons.join(' ')).toMatch(/assumed \(no RT25 entered\)/);
  });

  it('grades short notice when the plan starts sooner than the agreement asks', () => {
    const graded = gradeConflict({ ...base, hazard: productBeeHazard({ ld50UgPerBee: 50, rt25Hours: 1 }), noticeGivenHours: 20 })!;
    expect(graded.grade).toBe('short-notice');
    expect(graded.reasons[0]).toMatch(/20 h after notice; the agreement asks for 48 h/);
  });

  it('grades a low-toxicity spray while bees fly with colonies on site as flight hours', () => {
    const graded = gradeConflict({ ...base, hazard: productBeeHazard({ ld50UgPerBee: 50, rt25Hours: 1 }), hoursDuringBeeFlight: 3 })!;
    expect(graded.grades).toEqual(['flight-hours']);
    expect(graded.reasons[0]).toMatch(/evening application would be safer/);
  });

  it('grades an acutely toxic spray on bloom without colonies as bloom spray', () => {
    const graded = gradeConflict({ ...base, colonies: 0, contractedOnSprayedBlock: false, presentDuringSpray: false, noticeAgreedHours: null })!;
    expect(graded.grades).toEqual(['bloom-spray']);
  });
});

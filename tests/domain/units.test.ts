// Unit conversions against the exact definitions.
import { describe, it, expect } from 'vitest';
import {
  acresToHectares, hectaresToAcres, fahrenheitToCelsius, celsiusToFahrenheit, degreeDaysFahrenheitToCelsius,
  squareMetresToAcres, SQUARE_METRES_PER_ACRE, shownTemperature, temperatureFromForm,
} from '../../shared/domain/units.js';

describe('area', () => {
  it('1 acre = 4,046.8564224 m² = 0.40468564224 ha exactly', () => {
    // Source: NIST Handbook 44 (2024), Appendix C, General Tables of Units of Measurement.
    expect(SQUARE_METRES_PER_ACRE).toBe(4046.8564224);
    expect(acresToHectares(1)).toBeCloseTo(0.40468564224, 14);
    expect(squareMetresToAcres(43_560 * 0.09290304)).toBeCloseTo(1, 12); // 43,560 ft², 1 ft² = 0.09290304 m² (NIST HB 44)
  });

  it('hectares back to acres', () => {
    // Source: NIST Handbook 44, Appendix C (1 ha = 2.471 acres to four figures).
    expect(hectaresToAcres(1)).toBeCloseTo(2.4710538, 6);
    expect(hectaresToAcres(acresToHectares(37.5))).toBeCloseTo(37.5, 12);
  });
});

describe('temperature', () => {
  it('°C = (°F - 32) x 5/9 at the fixed points', () => {
    // Source: NIST Handbook 44, Appendix C; water freezes at 32 °F / 0 °C, boils at 212 °F / 100 °C.
    expect(fahrenheitToCelsius(32)).toBe(0);
    expect(fahrenheitToCelsius(212)).toBe(100);
    expect(fahrenheitToCelsius(-40)).toBe(-40);
    expect(celsiusToFahrenheit(100)).toBe(212);
    // Source: California pest control advisers' pollinator poster: bees inactive below 55 °F (12.8 °C).
    expect(fahrenheitToCelsius(55)).toBeCloseTo(12.8, 1);
  });

  it('a degree-day total converts as an interval (x 5/9, no 32° offset)', () => {
    // Source: UC IPM degree-day methods: DD°F = 1.8 x DD°C.
    expect(degreeDaysFahrenheitToCelsius(18)).toBe(10);
    expect(degreeDaysFahrenheitToCelsius(0)).toBe(0);
  });
});

describe('temperatures in forms', () => {
  // °C = (°F − 32) × 5/9 (NIST SP 811, 2008): 43 °F = 6.111… °C, shown as 6.1 °C; 6.1 °C = 42.98 °F.
  it('sends back exactly 43 °F when a threshold shown as 6.1 °C is left unchanged', () => {
    expect(shownTemperature(43, 'C')).toBe(6.1);
    expect(temperatureFromForm(6.1, 'C', 43)).toBe(43);
    expect(temperatureFromForm(shownTemperature(50, 'C'), 'C', 50)).toBe(50);
  });

  it('converts a changed value, and passes °F through', () => {
    expect(temperatureFromForm(10, 'C', 43)).toBeCloseTo(50, 9);
    expect(temperatureFromForm(6.1, 'C', null)).toBeCloseTo(42.98, 9);
    expect(temperatureFromForm(45, 'F', 43)).toBe(45);
    expect(shownTemperature(43, 'F')).toBe(43);
  });
});

// Unit conversions. We store SI (square metres, °C) and show what the user prefers.
// Source: NIST Handbook 44, Appendix C (1 acre = 4,046.8564224 m² exactly).

export const SQUARE_METRES_PER_ACRE = 4046.8564224;
export const SQUARE_METRES_PER_HECTARE = 10_000;
const HECTARES_PER_ACRE = SQUARE_METRES_PER_ACRE / SQUARE_METRES_PER_HECTARE;

export function acresToHectares(acres: number): number {
  return acres * HECTARES_PER_ACRE;
}

export function hectaresToAcres(hectares: number): number {
  return hectares / HECTARES_PER_ACRE;
}

export function squareMetresToAcres(m2: number): number {
  return m2 / SQUARE_METRES_PER_ACRE;
}

export function acresToSquareMetres(acres: number): number {
  return acres * SQUARE_METRES_PER_ACRE;
}

export function fahrenheitToCelsius(f: number): number {
  return ((f - 32) * 5) / 9;
}

export function celsiusToFahrenheit(c: number): number {
  return (c * 9) / 5 + 32;
}

/** A degree-day total is an interval of temperature: scale by 5/9, no 32° offset. */
export function degreeDaysFahrenheitToCelsius(ddF: number): number {
  return (ddF * 5) / 9;
}

export function degreeDaysCelsiusToFahrenheit(ddC: number): number {
  return (ddC * 9) / 5;
}

export type TemperatureUnit = 'F' | 'C';

/** A stored °F value as a form shows it: °F as stored, °C rounded to one decimal. */
export function shownTemperature(fahrenheit: number, unit: TemperatureUnit): number {
  return unit === 'F' ? fahrenheit : Number(fahrenheitToCelsius(fahrenheit).toFixed(1));
}

/**
 * The °F value a form sends back. A shown value left unchanged returns the stored value
 * exactly (43 °F is shown as 6.1 °C, and 6.1 °C is 42.98 °F, not 43); a changed one is converted.
 */
export function temperatureFromForm(shown: number, unit: TemperatureUnit, storedFahrenheit: number | null): number {
  if (storedFahrenheit !== null && shown === shownTemperature(storedFahrenheit, unit)) return storedFahrenheit;
  return unit === 'F' ? shown : celsiusToFahrenheit(shown);
}

/** How temperatures are shown: degrees Celsius or Fahrenheit. */
export type TemperatureUnit = 'C' | 'F';

/** Degrees Celsius to degrees Fahrenheit (°F = °C × 9/5 + 32). */
export function celsiusToFahrenheit(celsius: number): number {
  return (celsius * 9) / 5 + 32;
}

/** A temperature difference in kelvin/°C as a difference in °F (× 9/5, no offset). */
export function celsiusDeltaToFahrenheit(delta: number): number {
  return (delta * 9) / 5;
}

/** A temperature in °C shown in the chosen unit with one decimal, e.g. "18.0 °C" or "64.4 °F". */
export function formatTemperature(celsius: number | null | undefined, unit: TemperatureUnit): string {
  if (celsius == null || !Number.isFinite(celsius)) return '—';
  const value = unit === 'F' ? celsiusToFahrenheit(celsius) : celsius;
  // Avoid "-0.0" for readings a hair below zero.
  const text = (Math.round(value * 10) / 10 + 0).toFixed(1);
  return `${text === '-0.0' ? '0.0' : text} °${unit}`;
}

/** Degrees Fahrenheit to degrees Celsius (°C = (°F − 32) × 5/9). */
export function fahrenheitToCelsius(fahrenheit: number): number {
  return ((fahrenheit - 32) * 5) / 9;
}

/** A °C value in the chosen unit, unrounded. */
export function inUnit(celsius: number, unit: TemperatureUnit): number {
  return unit === 'F' ? celsiusToFahrenheit(celsius) : celsius;
}

/** A value in the chosen unit back in °C. */
export function toCelsius(value: number, unit: TemperatureUnit): number {
  return unit === 'F' ? fahrenheitToCelsius(value) : value;
}

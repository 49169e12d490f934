import {
  celsiusDeltaToFahrenheit,
  celsiusToFahrenheit,
  fahrenheitToCelsius,
  formatTemperature,
  inUnit,
  toCelsius,
} from './temperature-unit';

describe('celsiusToFahrenheit', () => {
  // NIST SP 811 (2008), B.9: t/°F = 1.8 · t/°C + 32.
  it('puts the freezing point of water at 32 °F', () => expect(celsiusToFahrenheit(0)).toBe(32));
  // NIST SP 811 (2008), B.9: 100 °C → 1.8 × 100 + 32 = 212 °F.
  it('puts the boiling point of water at 212 °F', () => expect(celsiusToFahrenheit(100)).toBe(212));
  // General reference: −40 is the one temperature equal on both scales.
  it('meets the Celsius scale at −40', () => expect(celsiusToFahrenheit(-40)).toBe(-40));
  // NIST SP 811 (2008), B.9: 45 °C → 1.8 × 45 + 32 = 113 °F.
  it('converts a hot pack at 45 °C to 113 °F', () => expect(celsiusToFahrenheit(45)).toBeCloseTo(113, 10));
});

describe('celsiusDeltaToFahrenheit', () => {
  // NIST SP 811 (2008), 4.2.1.1: a difference of 1 °C equals a difference of 1.8 °F.
  it('scales a 10 °C difference to 18 °F without the offset', () =>
    expect(celsiusDeltaToFahrenheit(10)).toBeCloseTo(18, 10));
});

describe('formatTemperature', () => {
  it('shows °C with one decimal', () => expect(formatTemperature(18, 'C')).toBe('18.0 °C'));
  // NIST SP 811 (2008), B.9: 18 °C → 1.8 × 18 + 32 = 64.4 °F.
  it('shows °F when the person prefers it', () => expect(formatTemperature(18, 'F')).toBe('64.4 °F'));
  it('shows a dash when there is no temperature', () => expect(formatTemperature(null, 'C')).toBe('—'));
  it('never shows minus zero', () => expect(formatTemperature(-0.01, 'C')).toBe('0.0 °C'));
});

describe('fahrenheitToCelsius', () => {
  // NIST SP 811 (2008), B.9: t/°C = (t/°F − 32)/1.8; 212 °F → 100 °C.
  it('brings 212 °F back to 100 °C', () => expect(fahrenheitToCelsius(212)).toBeCloseTo(100, 10));
  // NIST SP 811 (2008), B.9: 32 °F → 0 °C.
  it('brings 32 °F back to 0 °C', () => expect(fahrenheitToCelsius(32)).toBe(0));
  it('round-trips through the chosen unit', () => {
    expect(toCelsius(inUnit(45, 'F'), 'F')).toBeCloseTo(45, 10);
    expect(toCelsius(inUnit(45, 'C'), 'C')).toBe(45);
  });
});

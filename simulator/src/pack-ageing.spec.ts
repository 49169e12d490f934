import {
  AGEING_PARAMETERS,
  AgeingState,
  NEW_PACK,
  remainingCapacityFraction,
  stepAgeing,
} from './pack-ageing';

const R = 8.314;

/** Steps a pack of `capacityAh` for `hours` at a constant current and temperature, `stepSeconds` at a time. */
function age(
  hours: number,
  current: number,
  temperature: number,
  capacityAh = 100,
  from = NEW_PACK,
  stepSeconds = 60,
): AgeingState {
  let state = from;
  const steps = Math.round((hours * 3600) / stepSeconds);
  for (let i = 0; i < steps; i++) {
    state = stepAgeing(state, 'lifepo4', capacityAh, { current, temperature }, stepSeconds);
  }
  return state;
}

describe('pack ageing', () => {
  it('follows the published cycle-fade law at constant conditions', () => {
    // Wang et al., J. Power Sources 196 (2011) 3942–3948 (from memory): Q% = B·exp(−(Eₐ − 370.3·C)/(R·T))·Ah^0.55,
    // B = 31630 at C/2, Eₐ = 31700 J/mol, Ah the throughput of their 2.2 Ah cell.
    const state = age(400, -50, 25);
    const referenceAh = ((50 * 400) / 100) * 2.2;
    const expected =
      (31630 * Math.exp(-(31700 - 370.3 * 0.5) / (R * 298.15)) * Math.pow(referenceAh, 0.55)) / 100;
    expect(state.cycleFade).toBeCloseTo(expected, 9);
  });

  it('fades faster when hot, by the Arrhenius factor', () => {
    const cool = age(100, -20, 25).cycleFade;
    const hot = age(100, -20, 45).cycleFade;
    // Arrhenius: k(T) ∝ exp(−Eₐ/(R·T)) (Wang et al. 2011, from memory); at 0.2 C, Eₐ − 370.3·0.2.
    const factor = Math.exp(((31700 - 370.3 * 0.2) / R) * (1 / 298.15 - 1 / 318.15));
    expect(hot / cool).toBeCloseTo(factor, 6);
  });

  it('loses calendar capacity with the square root of time', () => {
    const oneYear = age(365.25 * 24, 0, 25, 100, NEW_PACK, 3600);
    const fourYears = age(3 * 365.25 * 24, 0, 25, 100, oneYear, 3600);
    expect(oneYear.calendarFade).toBeCloseTo(AGEING_PARAMETERS.lifepo4.calendarFadePerRootYear, 9);
    expect(fourYears.calendarFade).toBeCloseTo(2 * oneYear.calendarFade, 9);
    expect(oneYear.cycleFade).toBe(0);
  });

  it('carries the past into a change of temperature without rewriting it', () => {
    const warm = age(24 * 100, 0, 35, 100, NEW_PACK, 3600);
    const warmThenCold = age(24 * 100, 0, 5, 100, warm, 3600);
    expect(warmThenCold.calendarFade).toBeGreaterThan(warm.calendarFade);
    expect(warmThenCold.calendarFade).toBeLessThan(age(24 * 200, 0, 35, 100, NEW_PACK, 3600).calendarFade);
  });

  it('adds a penalty for charge put in below freezing, growing colder', () => {
    // One whole capacity charged at −5 °C and at −10 °C; none above freezing.
    const atMinus5 = age(10, 10, -5).coldChargeFade;
    const atMinus10 = age(10, 10, -10).coldChargeFade;
    expect(atMinus5).toBeCloseTo(AGEING_PARAMETERS.lifepo4.coldChargeFadePerCapacity * 2, 9);
    expect(atMinus10).toBeCloseTo(AGEING_PARAMETERS.lifepo4.coldChargeFadePerCapacity * 3, 9);
    expect(age(10, 10, 5).coldChargeFade).toBe(0);
    expect(age(10, -10, -5).coldChargeFade).toBe(0);
  });

  it('states the capacity left as one minus every part of the fade', () => {
    expect(
      remainingCapacityFraction({ cycleFade: 0.02, calendarFade: 0.01, coldChargeFade: 0.005 }),
    ).toBeCloseTo(0.965, 12);
    expect(remainingCapacityFraction(NEW_PACK)).toBe(1);
  });
});

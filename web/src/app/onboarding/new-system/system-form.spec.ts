import { FormControl, FormGroup } from '@angular/forms';
import { matchingZones, oneOfZones, withinRatings } from './system-form';

describe('new system form rules', () => {
  const zones = ['UTC', 'America/New_York', 'Europe/Oslo', 'Europe/Berlin'];

  it('finds zones by a part of their name, spaces for underscores', () => {
    expect(matchingZones(zones, 'new york')).toEqual(['America/New_York']);
    expect(matchingZones(zones, 'europe')).toEqual(['Europe/Oslo', 'Europe/Berlin']);
    expect(matchingZones(zones, 'e', 2)).toHaveLength(2);
  });

  it('accepts only a zone from the list', () => {
    const validate = oneOfZones(zones);
    expect(validate(new FormControl('Europe/Oslo'))).toBeNull();
    expect(validate(new FormControl('+01:00'))).toEqual({ zone: true });
  });

  it('flags usable capacity above rated, and a peak below the continuous rating', () => {
    const group = (values: Record<string, number>) =>
      new FormGroup(Object.fromEntries(Object.entries(values).map(([k, v]) => [k, new FormControl(v)])));
    expect(withinRatings(group({ ratedCapacityAh: 200, usableCapacityAh: 250 }))).toEqual({
      usableAboveRated: true,
    });
    expect(withinRatings(group({ bmsContinuousDischargeA: 200, bmsPeakDischargeA: 150 }))).toEqual({
      peakBelowContinuous: true,
    });
    expect(withinRatings(group({ ratedCapacityAh: 200, usableCapacityAh: 160 }))).toBeNull();
  });
});

import { planDevices } from './fleet';

describe('fleet plan', () => {
  it('makes ID-1 … ID-N with one secret, their own seeds and scenarios dealt out in turn', () => {
    const plans = planDevices({
      devices: [{ id: 'van', secret: 's3cret' }],
      fleet: 3,
      scenarios: ['a', 'b'],
      seed: 10,
    });
    expect(plans).toEqual([
      { id: 'van-1', secret: 's3cret', seed: 10, scenario: 'a' },
      { id: 'van-2', secret: 's3cret', seed: 11, scenario: 'b' },
      { id: 'van-3', secret: 's3cret', seed: 12, scenario: 'a' },
    ]);
  });

  it('keeps named devices as they are without --fleet', () => {
    const plans = planDevices({
      devices: [
        { id: 'a', secret: 'x' },
        { id: 'b', secret: 'y' },
      ],
      scenarios: ['frost-night'],
      seed: 1,
    });
    expect(plans.map((p) => [p.id, p.seed, p.scenario])).toEqual([
      ['a', 1, 'frost-night'],
      ['b', 2, 'frost-night'],
    ]);
  });
});

import { createDeviceRefusals } from './device-refusals';

describe('device refusals', () => {
  it('counts each kind per device and keeps the last code and time', () => {
    let clock = 1000;
    const refusals = createDeviceRefusals({ now: () => clock });
    refusals.count('van-1', 'credentials', 'bad_credentials');
    clock = 2000;
    refusals.count('van-1', 'payload', 'senml_unit_missing');
    refusals.count('cabin-1', 'topic', 'foreign_topic');
    expect(refusals.of('van-1')).toEqual({
      credentials: 1,
      topic: 0,
      payload: 1,
      last: { kind: 'payload', code: 'senml_unit_missing', at: 2000 },
    });
    expect(refusals.of('cabin-1').topic).toBe(1);
    expect(refusals.of('never-seen')).toEqual({ credentials: 0, topic: 0, payload: 0, last: null });
  });

  it('stays within its limit, forgetting the device refused longest ago', () => {
    const refusals = createDeviceRefusals({ limit: 3 });
    for (const id of ['a-1', 'b-1', 'c-1']) refusals.count(id, 'credentials', 'bad_credentials');
    refusals.count('a-1', 'credentials', 'bad_credentials');
    for (let i = 0; i < 1000; i++) refusals.count(`scan-${i}`, 'credentials', 'bad_credentials');
    expect(refusals.size).toBe(3);
    expect(refusals.of('scan-999').credentials).toBe(1);
    expect(refusals.of('a-1').credentials).toBe(0);
  });

  it('forgets a device when it is added afresh', () => {
    const refusals = createDeviceRefusals();
    refusals.count('van-1', 'credentials', 'bad_credentials');
    refusals.forget('van-1');
    expect(refusals.of('van-1').credentials).toBe(0);
  });

  it('does not let a caller change the stored counts through what it was given', () => {
    const refusals = createDeviceRefusals();
    refusals.count('van-1', 'topic', 'foreign_topic');
    refusals.of('van-1').topic = 99;
    expect(refusals.of('van-1').topic).toBe(1);
  });
});

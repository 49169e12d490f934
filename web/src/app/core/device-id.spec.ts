import { DEVICE_ID_PATTERN } from './device-id';

describe('DEVICE_ID_PATTERN', () => {
  // Cases from the rule in shared/src/api/access-contract.ts (DeviceRequest.id).
  it.each(['van-shunt-1', 'abc', '0cab', 'a'.repeat(63)])('accepts %s', (id) => {
    expect(DEVICE_ID_PATTERN.test(id)).toBe(true);
  });

  it.each(['ab', '-lead', 'Van-1', 'van_1', 'van 1', 'a'.repeat(64)])('refuses %s', (id) => {
    expect(DEVICE_ID_PATTERN.test(id)).toBe(false);
  });
});

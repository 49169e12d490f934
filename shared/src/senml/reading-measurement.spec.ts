import { isPackId, splitDeviceName, unitOfMeasurement } from './reading-measurement';

describe('reading measurements', () => {
  it('knows the unit of each measurement', () => {
    // RFC 8428 §12.1 units registry: V, A, Cel, %EL (remaining battery energy level), W
    expect(['voltage', 'current', 'temperature', 'soc', 'power'].map(unitOfMeasurement)).toEqual([
      'V',
      'A',
      'Cel',
      '%EL',
      'W',
    ]);
    expect(unitOfMeasurement('source:solar')).toBe('A');
  });

  it('knows no other measurement', () => {
    for (const name of ['humidity', 'toString', 'source:', 'source:a:b', 'Voltage']) {
      expect(unitOfMeasurement(name)).toBeUndefined();
    }
  });

  it('splits a resolved name into device and measurement', () => {
    expect(splitDeviceName('urn:dev:cw:van-1:voltage')).toEqual({
      deviceId: 'van-1',
      measurement: 'voltage',
    });
    expect(splitDeviceName('urn:dev:cw:van-1:source:dcdc')).toEqual({
      deviceId: 'van-1',
      measurement: 'source:dcdc',
    });
  });

  it('recognises names that are not Cellwarden names', () => {
    for (const name of ['urn:dev:ow:10e2073a01080063:voltage', 'urn:dev:cw:van-1', 'urn:dev:cw::voltage']) {
      expect(splitDeviceName(name)).toBeUndefined();
    }
  });

  it('accepts ids of letters, digits, dot, underscore and hyphen only', () => {
    expect(isPackId('van-1.b_2')).toBe(true);
    for (const id of ['', '-van', 'van 1', 'van:1', 'van/1', '__proto__']) expect(isPackId(id)).toBe(false);
  });
});

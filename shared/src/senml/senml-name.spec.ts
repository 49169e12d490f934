import { isSenmlName } from './senml-name';

describe('isSenmlName', () => {
  it('accepts the names of the RFC examples', () => {
    // RFC 8428 §5.1.2: a URN base name joined with a measurement name
    expect(isSenmlName('urn:dev:ow:10e2073a01080063:voltage')).toBe(true);
    expect(isSenmlName('urn:dev:cw:van-1:source:dc_dc.2')).toBe(true);
    expect(isSenmlName('2001:db8::2/temperature')).toBe(true);
  });

  it('refuses names outside the character set', () => {
    // RFC 8428 §4.5.1: only A-Z a-z 0-9 - : . / _
    for (const name of ['volt age', 'temp°', 'a+b', 'a#', 'ünit', 'x\n'])
      expect(isSenmlName(name)).toBe(false);
  });

  it('refuses names that do not start with a letter or digit, and the empty name', () => {
    // RFC 8428 §4.5.1: the first character must be A-Z, a-z or 0-9
    for (const name of ['', ':voltage', '-x', '_x', '/x', '.x']) expect(isSenmlName(name)).toBe(false);
  });
});

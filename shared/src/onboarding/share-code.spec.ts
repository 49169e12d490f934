import {
  formatShareCode,
  normalizeShareCode,
  SHARE_CODE_ALPHABET,
  SHARE_CODE_ATTEMPTS,
  SHARE_CODE_GLOBAL_ATTEMPTS,
  shareCodeFromBytes,
} from './share-code';

describe('share codes', () => {
  it('uses the 32 symbols of Crockford base32, without I, L, O or U', () => {
    // Crockford, "Base 32" (crockford.com/base32.html): the encode symbol set.
    expect(SHARE_CODE_ALPHABET).toBe('0123456789ABCDEFGHJKMNPQRSTVWXYZ');
    expect(new Set(SHARE_CODE_ALPHABET).size).toBe(32);
  });

  it('reads what a person types: lower case, spaces, a dash and look-alike letters', () => {
    expect(normalizeShareCode('k7qm-2xhd')).toBe('K7QM2XHD');
    expect(normalizeShareCode(' K7QM 2XHD ')).toBe('K7QM2XHD');
    // Crockford, "Base 32": decoding maps I and L to 1 and O to 0.
    expect(normalizeShareCode('IL0O-AAAA')).toBe('1100AAAA');
  });

  it('refuses a wrong length or a symbol outside the alphabet', () => {
    expect(normalizeShareCode('K7QM-2XH')).toBeNull();
    expect(normalizeShareCode('K7QM-2XHDD')).toBeNull();
    expect(normalizeShareCode('K7QM-2XHU')).toBeNull();
    expect(normalizeShareCode('')).toBeNull();
  });

  it('makes codes that read back to themselves, and shows them in two groups', () => {
    const code = shareCodeFromBytes(new Uint8Array([0, 31, 32, 63, 255, 100, 7, 200]));
    // 0, 31, 32 % 32 = 0, 63 % 32 = 31, 255 % 32 = 31, 100 % 32 = 4, 7, 200 % 32 = 8.
    expect(code).toBe('0Z0ZZ478');
    expect(normalizeShareCode(formatShareCode(code))).toBe(code);
    expect(formatShareCode('K7QM2XHD')).toBe('K7QM-2XHD');
  });

  it('keeps the chance of guessing a live code in one window below one in a hundred thousand', () => {
    // From the code's own arithmetic: 40 bits, 1,000 live codes, the global attempt ceiling per window.
    const perWindow = (SHARE_CODE_GLOBAL_ATTEMPTS * 1000) / 2 ** 40;
    expect(perWindow).toBeLessThan(1e-5);
    expect(SHARE_CODE_ATTEMPTS).toBeLessThanOrEqual(10);
  });
});

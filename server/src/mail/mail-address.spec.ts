import { AppError } from '../errors/app-error';
import { parseMailbox, parsePlainAddress } from './mail-address';

describe('parsePlainAddress', () => {
  // RFC 5322 §3.4.1 dot-atom addr-specs.
  it.each(['ada@example.test', 'ada.owner+alerts@mail.example.test', "o'brien@example.test"])(
    'accepts %s',
    (address) => {
      expect(parsePlainAddress(address, 'to')).toBe(address);
    },
  );

  it.each([
    'ada@example.test,eve@attacker.test',
    'ada@example.test\nBcc: eve@attacker.test',
    '<ada@example.test>',
    '"Ada" ada@example.test',
    'ada@localhost',
    `${'a'.repeat(250)}@example.test`,
    '',
  ])('refuses %j, naming the field', (address) => {
    expect(() => parsePlainAddress(address, 'to')).toThrow(AppError);
    expect(() => parsePlainAddress(address, 'to')).toThrow(/^to must be one plain e-mail address/);
  });
});

describe('parseMailbox', () => {
  it('reads a display name and address, stripping control characters from the name', () => {
    expect(parseMailbox('Cellwarden\r\nBcc: eve@attacker.test <alerts@cellwarden.test>', 'from')).toEqual({
      name: 'Cellwarden Bcc: eve@attacker.test',
      address: 'alerts@cellwarden.test',
    });
  });

  it('reads a bare address', () => {
    expect(parseMailbox('alerts@cellwarden.test', 'from')).toEqual({
      name: '',
      address: 'alerts@cellwarden.test',
    });
  });
});

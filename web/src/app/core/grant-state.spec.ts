import { grantState, granteeName } from './grant-state';

const NOW = Date.UTC(2026, 11, 2, 12);
const HOUR = 3_600_000;

describe('grantState', () => {
  it('calls a grant active before it expires', () => {
    expect(grantState({ revokedAt: null, expiresAt: NOW + HOUR }, NOW)).toBe('active');
  });

  it('calls a grant expired from its expiry instant on', () => {
    expect(grantState({ revokedAt: null, expiresAt: NOW }, NOW)).toBe('expired');
  });

  it('keeps a revoked grant revoked, even once past its expiry', () => {
    expect(grantState({ revokedAt: NOW - 2 * HOUR, expiresAt: NOW - HOUR }, NOW)).toBe('revoked');
  });
});

describe('granteeName', () => {
  it('names a company grantee by its name', () => {
    expect(
      granteeName({ granteeCompany: { id: 'c1', name: 'Harbour Volt Service' }, granteeUser: null }),
    ).toBe('Harbour Volt Service');
  });

  it('names a person by display name and e-mail', () => {
    const person = { id: 'u2', email: 'kim@example.com', displayName: 'Kim' };
    expect(granteeName({ granteeCompany: null, granteeUser: person })).toBe('Kim (kim@example.com)');
  });
});

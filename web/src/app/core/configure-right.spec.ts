import type { Grant } from '@cellwarden/shared';
import { configureRight, readOnlyReason } from './configure-right';

const grant = (over: Partial<Grant> = {}): Grant => ({
  id: 'g1',
  systemId: 'van-1',
  systemName: 'Blue van',
  access: 'view',
  granteeCompany: { id: 'c1', name: 'Fitters' },
  granteeUser: null,
  grantedBy: { id: 'u1', displayName: 'Mara Owner' },
  createdAt: 0,
  expiresAt: 5_000,
  revokedAt: null,
  active: true,
  ...over,
});
const READ_ONLY = { canConfigure: false, viewGrant: null };
const OWNER = [
  'view',
  'export',
  'configure',
  'manage-devices',
  'manage-grants',
  'read-audit',
  'commission',
] as const;
const VIEW = ['view', 'export'] as const;

describe('configureRight', () => {
  it('lets anyone act whom the server allows to configure: owner, installer, configure grant', () => {
    expect(configureRight(OWNER, [], 'van-1').canConfigure).toBe(true);
    expect(
      configureRight(['view', 'export', 'configure', 'manage-devices', 'commission'], [], 'van-1'),
    ).toEqual({
      canConfigure: true,
      viewGrant: null,
    });
    expect(
      configureRight(['view', 'export', 'configure'], [grant({ access: 'configure' })], 'van-1').canConfigure,
    ).toBe(true);
  });

  it('keeps a view grant read-only, naming the grant', () =>
    expect(configureRight(VIEW, [grant()], 'van-1')).toEqual({
      canConfigure: false,
      viewGrant: { grantedBy: 'Mara Owner', expiresAt: 5_000 },
    }));

  it('keeps a company admin read-only, with no grant to name', () =>
    expect(configureRight(['view', 'export', 'read-audit'], [], 'van-1')).toEqual(READ_ONLY));

  it('names only an active grant of this system', () =>
    expect(
      configureRight(
        VIEW,
        [grant({ systemId: 'cabin-1' }), grant({ active: false, expiresAt: 9_000 })],
        'van-1',
      ),
    ).toEqual(READ_ONLY));

  it('leaves the form open when the server did not say, for the server to decide on save', () =>
    expect(configureRight(null, null, 'van-1').canConfigure).toBe(true));
});

describe('readOnlyReason', () => {
  const until = (ms: number) => `t${ms}`;
  it('names whose view grant it is and until when', () =>
    expect(
      readOnlyReason(
        { canConfigure: false, viewGrant: { grantedBy: 'Mara Owner', expiresAt: 5_000 } },
        'you can read these settings but not change them',
        until,
      ),
    ).toContain('granted by Mara Owner until t5000: you can read these settings but not change them.'));

  it('says who could act when there is no grant to name', () =>
    expect(readOnlyReason(READ_ONLY, 'you can read these alerts but not acknowledge them', until)).toMatch(
      /^You can read these alerts but not acknowledge them: that needs the owner/,
    ));
});

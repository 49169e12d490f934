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
const support = ['support'];
const READ_ONLY = { canConfigure: false, viewGrant: null };

describe('configureRight', () => {
  it('lets the owner act', () =>
    expect(configureRight('owner', ['owner'], [], 'van-1').canConfigure).toBe(true));

  it('lets a person with an active grant to configure act', () =>
    expect(configureRight('not-owner', support, [grant({ access: 'configure' })], 'van-1').canConfigure).toBe(
      true,
    ));

  it('keeps a support person’s view grant read-only, naming the grant', () =>
    expect(configureRight('not-owner', support, [grant()], 'van-1')).toEqual({
      canConfigure: false,
      viewGrant: { grantedBy: 'Mara Owner', expiresAt: 5_000 },
    }));

  it('keeps a company admin read-only', () =>
    expect(configureRight('not-owner', ['admin'], [], 'van-1')).toEqual(READ_ONLY));

  it('ignores grants of other systems and ended grants', () =>
    expect(
      configureRight(
        'not-owner',
        support,
        [grant({ systemId: 'cabin-1', access: 'configure' }), grant({ access: 'configure', active: false })],
        'van-1',
      ),
    ).toEqual(READ_ONLY));

  it('leaves an installer’s form open, since only the server knows whose installation it is', () =>
    expect(configureRight('not-owner', ['installer'], [grant()], 'van-1').canConfigure).toBe(true));

  it('leaves the form open when it cannot tell, for the server to decide', () => {
    expect(configureRight('unknown', support, [], 'van-1').canConfigure).toBe(true);
    expect(configureRight('not-owner', null, [], 'van-1').canConfigure).toBe(true);
    expect(configureRight('not-owner', support, null, 'van-1').canConfigure).toBe(true);
  });
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

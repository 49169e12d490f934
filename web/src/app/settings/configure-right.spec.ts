import type { Grant } from '@cellwarden/shared';
import { REFUSED_REASON, configureRight } from './configure-right';

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
const until = (ms: number) => `t${ms}`;

const support = ['support'];

describe('configureRight', () => {
  it('lets the owner change settings', () =>
    expect(configureRight('owner', ['owner'], [], 'van-1', until).canConfigure).toBe(true));

  it('lets a person with an active grant to configure change settings', () =>
    expect(
      configureRight('not-owner', support, [grant({ access: 'configure' })], 'van-1', until).canConfigure,
    ).toBe(true));

  it('keeps a support person’s view grant read-only and says whose grant it is and until when', () => {
    const right = configureRight('not-owner', support, [grant()], 'van-1', until);
    expect(right.canConfigure).toBe(false);
    expect(right.reason).toContain('view access to this system, granted by Mara Owner until t5000');
  });

  it('keeps a company admin read-only', () =>
    expect(configureRight('not-owner', ['admin'], [], 'van-1', until)).toEqual({
      canConfigure: false,
      reason: REFUSED_REASON,
    }));

  it('ignores grants of other systems and ended grants', () => {
    const right = configureRight(
      'not-owner',
      support,
      [grant({ systemId: 'cabin-1', access: 'configure' }), grant({ access: 'configure', active: false })],
      'van-1',
      until,
    );
    expect(right).toEqual({ canConfigure: false, reason: REFUSED_REASON });
  });

  it('leaves an installer’s form open, since only the server knows whose installation it is', () =>
    expect(configureRight('not-owner', ['installer'], [grant()], 'van-1', until).canConfigure).toBe(true));

  it('leaves the form open when it cannot tell, for the server to decide', () => {
    expect(configureRight('unknown', support, [], 'van-1', until).canConfigure).toBe(true);
    expect(configureRight('not-owner', null, [], 'van-1', until).canConfigure).toBe(true);
    expect(configureRight('not-owner', support, null, 'van-1', until).canConfigure).toBe(true);
  });
});

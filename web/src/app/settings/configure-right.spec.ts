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

describe('configureRight', () => {
  it('lets owners and the installer’s fitters (who may manage devices) change settings', () =>
    expect(configureRight('allowed', [grant()], 'van-1', until).canConfigure).toBe(true));

  it('lets a person with an active grant to configure change settings', () =>
    expect(configureRight('refused', [grant({ access: 'configure' })], 'van-1', until).canConfigure).toBe(
      true,
    ));

  it('keeps a view grant read-only and says whose grant it is and until when', () => {
    const right = configureRight('refused', [grant()], 'van-1', until);
    expect(right.canConfigure).toBe(false);
    expect(right.reason).toContain('view access to this system, granted by Mara Owner until t5000');
  });

  it('ignores grants of other systems and ended grants', () => {
    const right = configureRight(
      'refused',
      [grant({ systemId: 'cabin-1', access: 'configure' }), grant({ access: 'configure', active: false })],
      'van-1',
      until,
    );
    expect(right).toEqual({ canConfigure: false, reason: REFUSED_REASON });
  });

  it('leaves the form open when it cannot tell, for the server to decide', () => {
    expect(configureRight('unknown', [], 'van-1', until).canConfigure).toBe(true);
    expect(configureRight('refused', null, 'van-1', until).canConfigure).toBe(true);
  });
});

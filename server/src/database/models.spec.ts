import { Op, Sequelize } from 'sequelize';
import { initModels } from './models';

// No connection is opened: Sequelize connects on the first query, and these checks make none.
const offline = () => new Sequelize('postgres://nobody@127.0.0.1:1/none', { logging: false });

describe('initModels', () => {
  it('binds one set of models per connection, and the same set when asked again', () => {
    const primary = offline();
    const other = offline();
    const models = initModels(primary);
    expect(initModels(primary)).toBe(models);
    const others = initModels(other);
    expect(others.User).not.toBe(models.User);
    expect(models.User.sequelize).toBe(primary);
    expect(others.User.sequelize).toBe(other);
  });

  it('names the tables the migrations create, with snake_case columns', () => {
    const {
      User,
      Company,
      SignInSession,
      RefreshToken,
      Invitation,
      PasswordReset,
      AuditEntry,
      UserPreference,
    } = initModels(offline());
    expect(
      [User, Company, SignInSession, RefreshToken, Invitation, PasswordReset, AuditEntry, UserPreference].map(
        (model) => model.getTableName(),
      ),
    ).toEqual([
      'users',
      'companies',
      'sign_in_sessions',
      'refresh_tokens',
      'invitations',
      'password_resets',
      'audit_entries',
      'user_preferences',
    ]);
    expect(User.getAttributes().displayName.field).toBe('display_name');
    expect(RefreshToken.getAttributes().familyId.field).toBe('family_id');
    expect(SignInSession.getAttributes().userId.field).toBe('user_id');
  });

  it('keeps only the timestamps each table has', () => {
    const { User, RefreshToken, AuditEntry, UserPreference } = initModels(offline());
    expect(Object.keys(User.getAttributes())).toEqual(expect.arrayContaining(['createdAt', 'updatedAt']));
    expect(Object.keys(RefreshToken.getAttributes())).not.toContain('updatedAt');
    expect(Object.keys(AuditEntry.getAttributes())).not.toContain('createdAt');
    expect(Object.keys(UserPreference.getAttributes())).not.toContain('createdAt');
  });

  it('gives revocable and expiring rows an active scope on the database clock', () => {
    const { RefreshToken, Invitation, PasswordReset, SignInSession } = initModels(offline());
    const where = (model: { options: { scopes?: Record<string, unknown> } }) =>
      (model.options.scopes?.active as { where: Record<string | symbol, unknown> }).where;
    expect(where(RefreshToken).revokedAt).toBeNull();
    expect(where(Invitation).acceptedAt).toBeNull();
    expect(where(PasswordReset).usedAt).toBeNull();
    expect(where(SignInSession).endedAt).toBeNull();
    for (const model of [RefreshToken, Invitation, PasswordReset]) {
      const expiry = where(model).expiresAt as Record<symbol, { fn: string }>;
      expect(expiry[Op.gt].fn).toBe('now');
    }
  });

  it("names the systems, grants and devices tables, and judges a grant active at the caller's instant", () => {
    const { System, AccessGrant, Device } = initModels(offline());
    expect([System, AccessGrant, Device].map((model) => model.getTableName())).toEqual([
      'systems',
      'grants',
      'devices',
    ]);
    expect(System.getAttributes().flagThresholds.field).toBe('flag_thresholds');
    expect(AccessGrant.getAttributes().grantedBy.field).toBe('granted_by');
    expect(Object.keys(AccessGrant.getAttributes())).not.toContain('updatedAt');
    expect(Object.keys(Device.getAttributes())).toEqual(expect.arrayContaining(['createdAt', 'updatedAt']));
    // The access rule decides every grant of one request at the same `now` (epoch ms), which tests move.
    const active = AccessGrant.options.scopes?.active as (now: number) => {
      where: Record<string, unknown>;
    };
    const { where } = active(Date.UTC(2026, 0, 1));
    expect(where.revokedAt).toBeNull();
    expect((where.expiresAt as Record<symbol, Date>)[Op.gt]).toEqual(new Date('2026-01-01T00:00:00Z'));
    const deviceActive = Device.options.scopes?.active as { where: Record<string, unknown> };
    expect(deviceActive.where).toEqual({ revokedAt: null });
  });

  it('keeps an alert active until it ends, and its notices on the database clock', () => {
    const { SystemAlert, AlertNotice } = initModels(offline());
    expect([SystemAlert, AlertNotice].map((model) => model.getTableName())).toEqual([
      'alert_events',
      'alert_notices',
    ]);
    const active = SystemAlert.options.scopes?.active as { where: Record<string, unknown> };
    expect(active.where).toEqual({ endedAt: null });
    expect(Object.keys(SystemAlert.getAttributes())).not.toContain('createdAt');
    expect((AlertNotice.getAttributes().sentAt.defaultValue as { fn: string }).fn).toBe('now');
  });

  it("judges share codes, access requests and hand-overs at the caller's instant, and runs by their status", () => {
    const { ShareCode, AccessRequest, Handover, CommissioningRun } = initModels(offline());
    const at = Date.UTC(2026, 5, 1, 12);
    const scoped = (model: { options: { scopes?: Record<string, unknown> } }) =>
      (model.options.scopes?.active as (now: number) => { where: Record<string, unknown> })(at).where;
    const expiry = (where: Record<string, unknown>) => (where.expiresAt as Record<symbol, Date>)[Op.gt];
    expect([scoped(ShareCode).usedAt, expiry(scoped(ShareCode))]).toEqual([null, new Date(at)]);
    expect([scoped(AccessRequest).decision, expiry(scoped(AccessRequest))]).toEqual([null, new Date(at)]);
    expect([scoped(Handover).acceptedAt, expiry(scoped(Handover))]).toEqual([null, new Date(at)]);
    const running = CommissioningRun.options.scopes?.running as { where: Record<string, unknown> };
    expect(running.where).toEqual({ status: 'running' });
  });
});

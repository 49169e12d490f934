import type { Grant, PublicUser } from '@cellwarden/shared';
import type { AccountsRepository } from '../accounts/accounts-repository';
import type { AuditService } from '../audit/audit-service';
import { forbidden } from '../errors/app-error';
import type { SystemsService } from '../systems/systems-service';
import type { GrantsRepository } from './grants-repository';
import { createGrantsService, MAX_GRANT_MS } from './grants-service';

const NOW = Date.UTC(2026, 11, 3, 12);
const SYSTEM_ID = '0b3f6a9e-5d1c-4c8e-9a61-2f0d7e4b8c11';
const COMPANY_ID = '66666666-6666-4666-8666-666666666666';
const owner: PublicUser = {
  id: '11111111-1111-4111-8111-111111111111',
  email: 'owner@example.test',
  displayName: 'Owner',
  roles: ['owner'],
  companyId: null,
};
const other: PublicUser = { ...owner, id: '33333333-3333-4333-8333-333333333333', email: 'x@example.test' };
const RESEARCHER_ID = '77777777-7777-4777-8777-777777777777';

type Created = Parameters<GrantsRepository['create']>[0];

/** Grants kept in a list, people and one company by address and id, audit entries and access signals kept. */
function fakes() {
  const grants: (Created & { id: string; revokedAt: number | null })[] = [];
  const audited: { action: string; detail: string }[] = [];
  const revokedSignals: string[] = [];
  const toGrant = (g: (typeof grants)[number]): Grant => ({
    id: g.id,
    systemId: g.systemId,
    systemName: 'Van',
    access: g.access,
    granteeCompany: g.granteeCompanyId ? { id: g.granteeCompanyId, name: 'Sparks Ltd' } : null,
    granteeUser: g.granteeEmail ? { id: '', email: g.granteeEmail, displayName: g.granteeEmail } : null,
    grantedBy: { id: g.grantedBy, displayName: 'Owner' },
    createdAt: NOW,
    expiresAt: g.expiresAt.getTime(),
    revokedAt: g.revokedAt,
    active: g.revokedAt === null && g.expiresAt.getTime() > NOW,
  });
  const repository: Pick<GrantsRepository, 'listForSystem' | 'listReceived' | 'find' | 'create' | 'revoke'> =
    {
      listForSystem: async (systemId) => grants.filter((g) => g.systemId === systemId).map(toGrant),
      listReceived: async (userId) => grants.filter((g) => g.granteeUserId === userId).map(toGrant),
      async find(systemId, grantId) {
        const found = grants.find((g) => g.systemId === systemId && g.id === grantId);
        return found && toGrant(found);
      },
      async create(grant) {
        const id = `${grants.length + 1}`.padStart(8, '0') + '-0000-4000-8000-000000000000';
        grants.push({ ...grant, id, revokedAt: null });
        return id;
      },
      async revoke(systemId, grantId) {
        const found = grants.find((g) => g.systemId === systemId && g.id === grantId && g.revokedAt === null);
        if (found) found.revokedAt = NOW;
        return !!found;
      },
    };
  const accounts: Pick<AccountsRepository, 'findCompany' | 'findByEmail'> = {
    findCompany: async (id) => (id === COMPANY_ID ? { id, name: 'Sparks Ltd' } : undefined),
    findByEmail: async (email) =>
      email === 'researcher@example.test'
        ? {
            id: RESEARCHER_ID,
            email,
            displayName: 'R',
            passwordHash: 'x',
            roles: ['support'],
            companyId: null,
          }
        : undefined,
  };
  // Only the owner may manage grants here; the policy itself is the systems service's spec.
  const systems: Pick<SystemsService, 'getFor'> = {
    async getFor(user) {
      if (user.id !== owner.id)
        throw forbidden('Your access to this system does not include "manage-grants"');
      return { id: SYSTEM_ID } as Awaited<ReturnType<SystemsService['getFor']>>;
    },
  };
  const audit: Pick<AuditService, 'record'> = {
    record: async (_systemId, _actor, action, detail = '') => void audited.push({ action, detail }),
  };
  const service = createGrantsService({
    repository,
    accounts,
    systems,
    audit,
    now: () => NOW,
    onAccessRevoked: (systemId) => revokedSignals.push(systemId),
  });
  return { service, grants, audited, revokedSignals };
}

const inADay = new Date(NOW + 24 * 3600_000);

describe('grants service', () => {
  it('grants a company access until a date and records who and until when', async () => {
    const { service, audited } = fakes();
    const grant = await service.create(owner, SYSTEM_ID, {
      granteeCompanyId: COMPANY_ID,
      access: 'configure',
      expiresAt: inADay,
    });
    expect(grant).toMatchObject({ access: 'configure', granteeCompany: { id: COMPANY_ID }, active: true });
    expect(audited).toEqual([
      { action: 'grant.created', detail: `configure for Sparks Ltd until ${inADay.toISOString()}` },
    ]);
  });

  it('grants a person by address, trimmed and lower-cased, naming their account when there is one', async () => {
    const { service, grants } = fakes();
    await service.create(owner, SYSTEM_ID, {
      granteeEmail: '  Researcher@Example.TEST ',
      access: 'view',
      expiresAt: inADay,
    });
    await service.create(owner, SYSTEM_ID, {
      granteeEmail: 'new@example.test',
      access: 'view',
      expiresAt: inADay,
    });
    expect(grants.map((g) => [g.granteeEmail, g.granteeUserId])).toEqual([
      ['researcher@example.test', RESEARCHER_ID],
      // Waits for an account with that address (attached when an invitation creates it).
      ['new@example.test', null],
    ]);
  });

  it.each([
    ['now', new Date(NOW), 'expiresAt must be in the future'],
    [
      'past a year',
      new Date(NOW + MAX_GRANT_MS + 1),
      'expiresAt must be within a year; renew the grant later',
    ],
  ])(
    'refuses an expiry %s with a 400 naming expiresAt, storing nothing',
    async (_case, expiresAt, message) => {
      const { service, grants } = fakes();
      await expect(
        service.create(owner, SYSTEM_ID, { granteeCompanyId: COMPANY_ID, access: 'view', expiresAt }),
      ).rejects.toMatchObject({ status: 400, field: 'expiresAt', message });
      expect(grants).toEqual([]);
    },
  );

  it('names the wrong field for an unknown company and for the owner granting themselves', async () => {
    const { service } = fakes();
    await expect(
      service.create(owner, SYSTEM_ID, {
        granteeCompanyId: '99999999-9999-4999-8999-999999999999',
        access: 'view',
        expiresAt: inADay,
      }),
    ).rejects.toMatchObject({ status: 400, field: 'granteeCompanyId' });
    await expect(
      service.create(owner, SYSTEM_ID, {
        granteeEmail: 'OWNER@example.test',
        access: 'view',
        expiresAt: inADay,
      }),
    ).rejects.toMatchObject({ status: 400, field: 'granteeEmail' });
  });

  it('lets only someone who may manage grants list, grant or revoke', async () => {
    const { service, grants } = fakes();
    await expect(service.list(other, SYSTEM_ID)).rejects.toMatchObject({ status: 403 });
    await expect(
      service.create(other, SYSTEM_ID, { granteeCompanyId: COMPANY_ID, access: 'view', expiresAt: inADay }),
    ).rejects.toMatchObject({ status: 403 });
    expect(grants).toEqual([]);
  });

  it('revokes once: audited and signalled to the live stream the first time only', async () => {
    const { service, audited, revokedSignals } = fakes();
    const grant = await service.create(owner, SYSTEM_ID, {
      granteeCompanyId: COMPANY_ID,
      access: 'view',
      expiresAt: inADay,
    });
    await service.revoke(owner, SYSTEM_ID, grant.id);
    await service.revoke(owner, SYSTEM_ID, grant.id);
    expect(audited.map((a) => a.action)).toEqual(['grant.created', 'grant.revoked']);
    expect(revokedSignals).toEqual([SYSTEM_ID]);
    expect((await service.list(owner, SYSTEM_ID))[0]).toMatchObject({ active: false, revokedAt: NOW });
  });

  it('answers 404 for a grant id that is not a uuid or not on this system', async () => {
    const { service, revokedSignals } = fakes();
    await expect(service.revoke(owner, SYSTEM_ID, 'grant-1')).rejects.toMatchObject({ status: 404 });
    await expect(
      service.revoke(owner, SYSTEM_ID, '88888888-8888-4888-8888-888888888888'),
    ).rejects.toMatchObject({ status: 404 });
    expect(revokedSignals).toEqual([]);
  });
});

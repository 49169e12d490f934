import type { PublicUser, Role } from '@cellwarden/shared';
import type { GrantFacts } from '../access/access-policy';
import type { GrantsRepository } from '../access/grants-repository';
import { AppError } from '../errors/app-error';
import type { StoredSystem, SystemsRepository, Visibility } from './systems-repository';
import { createSystemsService } from './systems-service';

const NOW = Date.UTC(2026, 11, 3, 12);
const SYSTEM_ID = '0b3f6a9e-5d1c-4c8e-9a61-2f0d7e4b8c11';
const MISSING_ID = '7c2d9f10-8e4b-4a3c-b1d2-6e5f4a3b2c1d';
const OWNER_ID = '11111111-1111-4111-8111-111111111111';
const INSTALLERS = '22222222-2222-4222-8222-222222222222';

const person = (id: string, roles: Role[], companyId: string | null = null): PublicUser => ({
  id,
  email: `${id.slice(0, 4)}@example.test`,
  displayName: id.slice(0, 4),
  roles,
  companyId,
});
const owner = person(OWNER_ID, ['owner']);
const stranger = person('33333333-3333-4333-8333-333333333333', ['owner']);
const grantee = person('44444444-4444-4444-8444-444444444444', ['support']);
const fitter = person('55555555-5555-4555-8555-555555555555', ['installer'], INSTALLERS);

const system: StoredSystem = {
  id: SYSTEM_ID,
  name: 'Van',
  kind: 'van',
  chemistry: 'lifepo4',
  nominalVoltage: 12,
  ratedCapacityAh: 200,
  usableCapacityAh: 180,
  latestReading: null,
  ownerId: OWNER_ID,
  installerCompanyId: INSTALLERS,
};

/** In-memory systems and grants: only the lookups the service makes, counted. */
function fakes(grants: GrantFacts[] = []) {
  const lookups: string[] = [];
  const visibilityAsked: Visibility[] = [];
  const ownershipLookups: string[] = [];
  const repository: Pick<SystemsRepository, 'findById' | 'findOwnership' | 'listVisible'> = {
    async findById(id) {
      lookups.push(id);
      return id === SYSTEM_ID ? { ...system } : undefined;
    },
    async findOwnership(id) {
      ownershipLookups.push(id);
      return id === SYSTEM_ID
        ? { id: system.id, ownerId: system.ownerId, installerCompanyId: system.installerCompanyId }
        : undefined;
    },
    async listVisible(visibility) {
      visibilityAsked.push(visibility);
      return [system];
    },
  };
  const grantsRepository: Pick<GrantsRepository, 'factsForSystem'> = {
    factsForSystem: async (systemId) => (systemId === SYSTEM_ID ? grants : []),
  };
  const service = createSystemsService({ repository, grants: grantsRepository, now: () => NOW });
  return { service, lookups, ownershipLookups, visibilityAsked };
}

const viewGrant = (overrides: Partial<GrantFacts> = {}): GrantFacts => ({
  access: 'view',
  granteeUserId: grantee.id,
  granteeCompanyId: null,
  expiresAt: NOW + 3600_000,
  revokedAt: null,
  ...overrides,
});

async function statusOf(promise: Promise<unknown>): Promise<number | 'ok'> {
  try {
    await promise;
    return 'ok';
  } catch (error) {
    if (error instanceof AppError) return error.status;
    throw error;
  }
}

describe('systems service: opening a system through the access policy', () => {
  it('gives the owner the system and every owner action', async () => {
    const { service } = fakes();
    const opened = await service.openFor(owner, SYSTEM_ID, 'manage-grants');
    expect(opened.system.id).toBe(SYSTEM_ID);
    expect([...opened.access.allowed].sort()).toEqual(
      ['commission', 'configure', 'export', 'manage-devices', 'manage-grants', 'read-audit', 'view'].sort(),
    );
  });

  it('answers 404 to someone who may not even view it, the same as for a system that does not exist', async () => {
    const { service } = fakes();
    expect(await statusOf(service.getFor(stranger, SYSTEM_ID))).toBe(404);
    expect(await statusOf(service.getFor(stranger, SYSTEM_ID, 'configure'))).toBe(404);
    expect(await statusOf(service.getFor(owner, MISSING_ID))).toBe(404);
  });

  it('answers 404 for an id that is not a uuid without looking it up', async () => {
    const { service, lookups } = fakes();
    await expect(service.getFor(owner, 'not-a-uuid')).rejects.toMatchObject({
      status: 404,
      code: 'not_found',
    });
    expect(lookups).toEqual([]);
  });

  it('answers 403 to a view grantee asking to configure, and lets them view', async () => {
    const { service } = fakes([viewGrant()]);
    expect(await statusOf(service.getFor(grantee, SYSTEM_ID, 'view'))).toBe('ok');
    await expect(service.getFor(grantee, SYSTEM_ID, 'configure')).rejects.toMatchObject({
      status: 403,
      code: 'forbidden',
    });
  });

  it('keeps the grant-only answer no longer than the grant', async () => {
    const { service } = fakes([viewGrant()]);
    const opened = await service.openFor(grantee, SYSTEM_ID);
    expect(opened.access.validUntil).toBe(NOW + 3600_000);
  });

  it('answers 404 once a grant has expired or was revoked', async () => {
    expect(await statusOf(fakes([viewGrant({ expiresAt: NOW })]).service.getFor(grantee, SYSTEM_ID))).toBe(
      404,
    );
    expect(
      await statusOf(fakes([viewGrant({ revokedAt: NOW - 1 })]).service.getFor(grantee, SYSTEM_ID)),
    ).toBe(404);
  });

  it("lets the installer company's fitter commission it but answers 403 to managing its grants", async () => {
    const { service } = fakes();
    expect(await statusOf(service.getFor(fitter, SYSTEM_ID, 'commission'))).toBe('ok');
    expect(await statusOf(service.getFor(fitter, SYSTEM_ID, 'manage-grants'))).toBe(403);
  });

  it('authorizes by ownership alone, with the same 404 and 403 answers, never reading the summary', async () => {
    const { service, lookups, ownershipLookups } = fakes([viewGrant()]);
    expect(await service.authorize(owner, SYSTEM_ID, 'export')).toEqual({
      id: SYSTEM_ID,
      ownerId: OWNER_ID,
      installerCompanyId: INSTALLERS,
    });
    expect(await statusOf(service.authorize(grantee, SYSTEM_ID))).toBe('ok');
    expect(await statusOf(service.authorize(grantee, SYSTEM_ID, 'configure'))).toBe(403);
    expect(await statusOf(service.authorize(stranger, SYSTEM_ID))).toBe(404);
    expect(await statusOf(service.authorize(owner, MISSING_ID))).toBe(404);
    expect(await statusOf(service.authorize(owner, 'not-a-uuid'))).toBe(404);
    expect(lookups).toEqual([]);
    expect(ownershipLookups).toEqual([SYSTEM_ID, SYSTEM_ID, SYSTEM_ID, SYSTEM_ID, MISSING_ID]);
  });

  it('lists with company systems only for installers and admins, at the clock’s time', async () => {
    const { service, visibilityAsked } = fakes();
    await service.listFor(owner);
    await service.listFor(fitter);
    expect(visibilityAsked).toEqual([
      { userId: owner.id, companyId: null, seesCompanySystems: false, now: NOW },
      { userId: fitter.id, companyId: INSTALLERS, seesCompanySystems: true, now: NOW },
    ]);
  });
});

import type { PublicUser } from '@cellwarden/shared';
import { decideAccess, type GrantFacts, type SystemAction } from '../access/access-policy';
import type { AuditService } from '../audit/audit-service';
import { forbidden } from '../errors/app-error';
import type { SettingsRepository } from '../settings/settings-repository';
import type { SystemsService } from '../systems/systems-service';
import type { BatteryHealthRepository } from './battery-health-repository';
import { createBatteryHealthService } from './battery-health-service';

// The report asks the access rule for `export`, the screen for `view`: whoever the rule gives one without the
// other (no role or grant does today) gets the screen without the download buttons and a 403 for the file,
// and nothing is audited for a refused download.

const NOW = Date.UTC(2026, 11, 3);
const system = {
  id: 'van',
  name: 'Van',
  kind: 'van' as const,
  chemistry: 'lifepo4' as const,
  nominalVoltage: 12 as const,
  ratedCapacityAh: 200,
  usableCapacityAh: 190,
  latestReading: null,
  ownerId: 'owner',
  installerCompanyId: null,
};
const viewer: PublicUser = {
  id: 'v',
  email: 'v@example.com',
  displayName: 'V',
  roles: ['support'],
  companyId: null,
};

/** The systems service with a rule that allows only `allowed`, as the real one applies decideAccess. */
function systemsAllowing(allowed: SystemAction[], asked: SystemAction[]): SystemsService {
  const decision = { allowed: new Set(allowed), validUntil: Infinity };
  const openFor = async (_user: PublicUser, _id: string, action: SystemAction = 'view') => {
    asked.push(action);
    if (!decision.allowed.has(action))
      throw forbidden(`Your access to this system does not include "${action}"`);
    return { system, access: decision };
  };
  return {
    listFor: async () => [],
    openFor,
    getFor: async (user: PublicUser, id: string, action?: SystemAction) =>
      (await openFor(user, id, action)).system,
  } as unknown as SystemsService;
}

function service(allowed: SystemAction[]) {
  const asked: SystemAction[] = [];
  const audited: string[] = [];
  const health = createBatteryHealthService({
    systems: systemsAllowing(allowed, asked),
    settings: {
      find: async () => ({ name: 'Van', kind: 'van', timeZone: 'Europe/Helsinki' }),
    } as unknown as SettingsRepository,
    repository: {
      findCheckpoint: async () => undefined,
      listSamples: async () => [],
      completeHours: async () => [],
    } as unknown as BatteryHealthRepository,
    audit: {
      record: async (_s: string, _u: unknown, _a: string, detail: string) => void audited.push(detail),
    } as unknown as AuditService,
    now: () => NOW,
  });
  return { health, asked, audited };
}

describe('battery health access', () => {
  it('a view grant carries export today, by the access rule itself', () => {
    const grant: GrantFacts = {
      access: 'view',
      granteeUserId: 'v',
      granteeCompanyId: null,
      expiresAt: NOW + 1,
      revokedAt: null,
    };
    expect(decideAccess(viewer, system, [grant], NOW).allowed.has('export')).toBe(true);
  });

  it('shows the screen to a viewer without export, without the downloads', async () => {
    const { health, asked } = service(['view']);
    const overview = await health.overview(viewer, 'van', 'en-GB');
    expect(overview.mayExport).toBe(false);
    expect(asked).toEqual(['view']);
  });

  it('refuses the report to a viewer without export with 403, auditing nothing', async () => {
    const { health, asked, audited } = service(['view']);
    await expect(
      health.report(viewer, 'van', { from: NOW - 86_400_000, to: NOW, format: 'pdf', locale: 'en' }),
    ).rejects.toMatchObject({ status: 403 });
    expect(asked).toEqual(['export']);
    expect(audited).toEqual([]);
  });

  it('makes the report for someone with export and audits the download with its period', async () => {
    const { health, audited } = service(['view', 'export']);
    const report = await health.report(viewer, 'van', {
      from: NOW - 86_400_000,
      to: NOW,
      format: 'csv',
      locale: 'en',
    });
    expect(report.covered).toBeNull();
    expect(audited).toEqual([
      'battery health report (CSV) 2026-12-02T00:00:00.000Z – 2026-12-03T00:00:00.000Z',
    ]);
  });
});

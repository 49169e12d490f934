import type { HistoryPoint, PublicUser } from '@cellwarden/shared';
import type { AuditService } from '../audit/audit-service';
import { notFound } from '../errors/app-error';
import type { SystemsService } from '../systems/systems-service';
import type { ReadingsRepository } from './readings-repository';
import { createReadingsService, POINT_BUDGET } from './readings-service';

const NOW = Date.UTC(2026, 11, 3, 12);
const SYSTEM_ID = '0b3f6a9e-5d1c-4c8e-9a61-2f0d7e4b8c11';
const viewer: PublicUser = {
  id: '11111111-1111-4111-8111-111111111111',
  email: 'owner@example.test',
  displayName: 'Owner',
  roles: ['owner'],
  companyId: null,
};
const DAY = 24 * 3600_000;

/** Readings that answer one point per request, a policy that lets `viewer` view one system, audit kept. */
function fakes() {
  const asked: { systemId: string; from: number; to: number; bucketMs: number; limit: number }[] = [];
  const audited: { action: string; detail: string }[] = [];
  const repository: Pick<ReadingsRepository, 'listDownsampled'> = {
    async listDownsampled(systemId, from, to, bucketMs, limit) {
      asked.push({ systemId, from: from.getTime(), to: to.getTime(), bucketMs, limit });
      const point: HistoryPoint = { measuredAt: from.getTime(), voltage: 13.2, current: -4, temperature: 18 };
      return [point];
    },
  };
  const systems: Pick<SystemsService, 'authorize'> = {
    async authorize(user, systemId) {
      if (user.id !== viewer.id || systemId !== SYSTEM_ID) throw notFound('System');
      return { id: SYSTEM_ID, ownerId: viewer.id, installerCompanyId: null };
    },
  };
  const audit: Pick<AuditService, 'record'> = {
    record: async (_systemId, _actor, action, detail = '') => void audited.push({ action, detail }),
  };
  const service = createReadingsService({ systems, repository, audit, now: () => NOW });
  return { service, asked, audited };
}

const iso = (ms: number) => new Date(ms).toISOString();

describe('readings service: history', () => {
  it('reads the last hour by default, in buckets that keep the series within the point budget', async () => {
    const { service, asked, audited } = fakes();
    const answer = await service.history(viewer, SYSTEM_ID, {});
    // 3,600 s over 2,000 points: 1.8 s buckets, named to the nearest second.
    expect(asked).toEqual([
      { systemId: SYSTEM_ID, from: NOW - 3600_000, to: NOW, bucketMs: 1800, limit: POINT_BUDGET },
    ]);
    expect(answer.resolution).toBe('2s');
    expect(answer.points).toHaveLength(1);
    expect(audited).toEqual([{ action: 'readings.viewed', detail: `${iso(NOW - 3600_000)} – ${iso(NOW)}` }]);
  });

  it('serves raw readings while a bucket would be a second or less, and buckets beyond', async () => {
    const { service } = fakes();
    const raw = await service.history(viewer, SYSTEM_ID, { from: iso(NOW - 2000_000), to: iso(NOW) });
    expect(raw.resolution).toBe('raw');
    const slightlyLonger = await service.history(viewer, SYSTEM_ID, {
      from: iso(NOW - 2000_001),
      to: iso(NOW),
    });
    expect(slightlyLonger.resolution).toBe('1s');
    const week = await service.history(viewer, SYSTEM_ID, { from: iso(NOW - 7 * DAY), to: iso(NOW) });
    // 604,800 s / 2,000 = 302.4 s, rounded up to whole milliseconds, named to the second.
    expect(week.resolution).toBe('302s');
  });

  it('accepts a range of exactly 400 days and refuses a longer one, naming from', async () => {
    const { service, asked } = fakes();
    await service.history(viewer, SYSTEM_ID, { from: iso(NOW - 400 * DAY), to: iso(NOW) });
    await expect(
      service.history(viewer, SYSTEM_ID, { from: iso(NOW - 400 * DAY - 1), to: iso(NOW) }),
    ).rejects.toMatchObject({ status: 400, field: 'from', message: 'range must be at most 400 days' });
    expect(asked).toHaveLength(1);
  });

  it('refuses from at or after to, naming from', async () => {
    const { service } = fakes();
    await expect(service.history(viewer, SYSTEM_ID, { from: iso(NOW), to: iso(NOW) })).rejects.toMatchObject({
      status: 400,
      field: 'from',
      message: 'from must be before to',
    });
  });

  it('names the field of a time without a zone or not a string, and reads nothing', async () => {
    const { service, asked } = fakes();
    await expect(service.history(viewer, SYSTEM_ID, { to: '2026-12-03T12:00:00' })).rejects.toMatchObject({
      status: 400,
      field: 'to',
    });
    await expect(service.history(viewer, SYSTEM_ID, { from: 1_700_000_000_000 })).rejects.toMatchObject({
      status: 400,
      field: 'from',
    });
    expect(asked).toEqual([]);
  });

  it('answers 404 and records no view when the policy refuses; an id that is not a uuid is not read', async () => {
    const { service, asked, audited } = fakes();
    const stranger = { ...viewer, id: '33333333-3333-4333-8333-333333333333' };
    await expect(service.history(stranger, SYSTEM_ID, {})).rejects.toMatchObject({ status: 404 });
    await expect(service.history(viewer, 'van-1', {})).rejects.toMatchObject({ status: 404 });
    expect(asked.map((a) => a.systemId)).toEqual([SYSTEM_ID]);
    expect(audited).toEqual([]);
  });
});

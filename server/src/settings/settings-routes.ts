import { Router } from 'express';
import { FLAG_KINDS } from '@cellwarden/shared';
import { z } from 'zod';
import type { SettingsService } from './settings-service';
import { isKnownTimeZone } from './utc-offset';
import { createSystemRouter } from '../systems/system-router';

const positive = (field: string, max: number) =>
  z
    .number({ error: `${field} must be a number` })
    .positive(`${field} must be above 0`)
    .max(max, `${field} must be at most ${max}`);
const plainText = (field: string, max: number) =>
  z
    .string({ error: `${field} is required` })
    .trim()
    .min(1, `${field} is required`)
    .max(max, `${field} must be at most ${max} characters`)
    .regex(/^[^\p{Cc}]*$/u, `${field} must not contain control characters`);

const settingsBody = z
  .object({
    name: plainText('name', 120),
    kind: z.enum(['van', 'cabin', 'boat'], { error: 'kind must be van, cabin or boat' }),
    timeZone: z
      .string({ error: 'timeZone is required' })
      .refine(isKnownTimeZone, 'timeZone must be an IANA zone such as Europe/Oslo'),
    battery: z.object({
      chemistry: z.enum(['lifepo4', 'agm', 'flooded'], {
        error: 'chemistry must be lifepo4, agm or flooded',
      }),
      nominalVoltage: z.union([z.literal(12), z.literal(24), z.literal(48)], {
        error: 'nominalVoltage must be 12, 24 or 48',
      }),
      ratedCapacityAh: positive('ratedCapacityAh', 10000),
      usableCapacityAh: positive('usableCapacityAh', 10000),
    }),
    bms: z.object({
      continuousDischargeA: positive('continuousDischargeA', 2000),
      lowVoltageCutoffV: positive('lowVoltageCutoffV', 70).nullable(),
    }),
    chargeSources: z
      .array(
        z.object({
          id: z
            .string({ error: 'id is required' })
            .regex(/^[a-z0-9][a-z0-9-]{0,31}$/, 'id must be lowercase letters, digits or dashes'),
          kind: z.enum(['dc-dc', 'solar', 'shore', 'alternator', 'other'], {
            error: 'kind is not a known charge source',
          }),
          label: plainText('label', 60),
          ratedCurrentA: positive('ratedCurrentA', 1000),
        }),
      )
      .max(12, 'at most 12 charge sources')
      .refine(
        (sources) => new Set(sources.map((s) => s.id)).size === sources.length,
        'each charge source needs its own id',
      ),
    thresholds: z.object({
      lowChargeWarningPercent: z.number().min(1).max(95),
      lowChargeCriticalPercent: z.number().min(0).max(90),
      lowVoltageV: positive('lowVoltageV', 70),
      overTemperatureC: z.number().min(20).max(80),
      silentAfterMinutes: z.number().int().min(1).max(1440),
    }),
  })
  .refine((s) => s.battery.usableCapacityAh <= s.battery.ratedCapacityAh, {
    message: 'usableCapacityAh cannot be more than ratedCapacityAh',
    path: ['battery', 'usableCapacityAh'],
  })
  .refine((s) => s.thresholds.lowChargeCriticalPercent < s.thresholds.lowChargeWarningPercent, {
    message: 'the critical level must be below the warning level',
    path: ['thresholds', 'lowChargeCriticalPercent'],
  });

const preferencesBody = z.object({
  temperatureUnit: z.enum(['C', 'F'], { error: 'temperatureUnit must be C or F' }),
  emailFlags: z
    .array(z.enum(FLAG_KINDS, { error: 'emailFlags holds an unknown flag kind' }))
    .max(FLAG_KINDS.length),
});

/** GET/PUT /api/systems/:systemId/settings. */
export function createSettingsRoutes(settings: SettingsService): Router {
  const router = createSystemRouter();
  router.get('/:systemId/settings', async (req, res) => {
    res.json({ settings: await settings.get(req.currentUser!, req.params.systemId) });
  });
  router.put('/:systemId/settings', async (req, res) => {
    const body = settingsBody.parse(req.body ?? {});
    res.json({ settings: await settings.update(req.currentUser!, req.params.systemId, body) });
  });
  return router;
}

/** GET/PUT /api/me/preferences. */
export function createPreferencesRoutes(settings: SettingsService): Router {
  const router = Router();
  router.get('/preferences', async (req, res) => {
    res.json({ preferences: await settings.preferences(req.currentUser!) });
  });
  router.put('/preferences', async (req, res) => {
    const body = preferencesBody.parse(req.body ?? {});
    res.json({
      preferences: await settings.savePreferences(req.currentUser!, {
        ...body,
        emailFlags: [...new Set(body.emailFlags)],
      }),
    });
  });
  return router;
}

import { Router } from 'express';
import { z } from 'zod';
import { isKnownTimeZone } from '../settings/utc-offset';
import { parseNamingEveryField } from './every-field';
import type { OnboardingService } from './onboarding-service';
import { createSystemRouter } from '../systems/system-router';

const amps = (field: string) =>
  z
    .number({ error: `${field} must be a number of amperes` })
    .positive(`${field} must be above 0`)
    .max(5000, `${field} must be at most 5000`);
const capacity = (field: string) =>
  z
    .number({ error: `${field} must be a number of amp-hours` })
    .positive(`${field} must be above 0`)
    .max(10000, `${field} must be at most 10000`);

// IANA names (Area/Location, or UTC); Intl alone would also take offsets such as "+01:00".
const IANA_NAME = /^[A-Za-z][A-Za-z_]*(\/[A-Za-z0-9_+-]+)*$/;

const newSystemBody = z
  .object({
    name: z
      .string({ error: 'name is required' })
      .trim()
      .min(1, 'name is required')
      .max(120, 'name must be at most 120 characters')
      .regex(/^[^\p{Cc}]*$/u, 'name must not contain control characters'),
    kind: z.enum(['van', 'cabin', 'boat'], { error: 'kind must be van, cabin or boat' }),
    nominalVoltage: z.union([z.literal(12), z.literal(24), z.literal(48)], {
      error: 'nominalVoltage must be 12, 24 or 48',
    }),
    chemistry: z.enum(['lifepo4', 'agm', 'flooded'], { error: 'chemistry must be lifepo4, agm or flooded' }),
    ratedCapacityAh: capacity('ratedCapacityAh'),
    usableCapacityAh: capacity('usableCapacityAh'),
    bmsContinuousDischargeA: amps('bmsContinuousDischargeA'),
    bmsPeakDischargeA: amps('bmsPeakDischargeA'),
    coldChargeCutoff: z.boolean({ error: 'coldChargeCutoff must be true or false' }),
    timeZone: z
      .string({ error: 'timeZone is required' })
      .refine((zone) => IANA_NAME.test(zone) && isKnownTimeZone(zone), {
        message: 'timeZone must be an IANA zone such as Europe/Oslo',
      }),
    ownerEmail: z
      .string({ error: 'ownerEmail must be an e-mail address' })
      .trim()
      .toLowerCase()
      .max(254, 'ownerEmail must be at most 254 characters')
      .email('ownerEmail must be an e-mail address')
      .optional(),
  })
  .superRefine((body, context) => {
    if (body.usableCapacityAh > body.ratedCapacityAh)
      context.addIssue({
        code: 'custom',
        path: ['usableCapacityAh'],
        message: 'usableCapacityAh must not exceed ratedCapacityAh',
      });
    if (body.bmsPeakDischargeA < body.bmsContinuousDischargeA)
      context.addIssue({
        code: 'custom',
        path: ['bmsPeakDischargeA'],
        message: 'bmsPeakDischargeA must be at least bmsContinuousDischargeA',
      });
  });

/** POST /api/systems, DELETE /api/systems/:id/installer, GET /api/systems/:id/devices/:deviceId/status. */
export function createOnboardingRoutes(onboarding: OnboardingService): Router {
  const router = createSystemRouter();
  router.post('/', async (req, res) => {
    const body = parseNamingEveryField(newSystemBody, req.body);
    res.status(201).json(await onboarding.create(req.currentUser!, body));
  });
  router.delete('/:systemId/installer', async (req, res) => {
    await onboarding.removeInstaller(req.currentUser!, req.params.systemId);
    res.status(204).end();
  });
  router.get('/:systemId/devices/:deviceId/status', async (req, res) => {
    res.json(await onboarding.monitorStatus(req.currentUser!, req.params.systemId, req.params.deviceId));
  });
  return router;
}

/** GET /api/handovers, POST /api/handovers/:id/accept: systems set up for me. */
export function createHandoverRoutes(onboarding: OnboardingService): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    res.json({ handovers: await onboarding.listHandovers(req.currentUser!) });
  });
  router.post('/:handoverId/accept', async (req, res) => {
    res.json(await onboarding.acceptHandover(req.currentUser!, req.params.handoverId));
  });
  return router;
}

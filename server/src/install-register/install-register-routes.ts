import type { Router } from 'express';
import { z } from 'zod';
import { AWG_SIZES, type CircuitWiring, type ComponentRatings } from '@cellwarden/shared';
import { invalidInput } from '../errors/app-error';
import type { DesignVsMeasuredService } from './design-vs-measured-service';
import { DEFAULT_WINDOW_DAYS, MAX_WINDOW_DAYS } from './design-vs-measured-service';
import type { InstallRegisterService } from './install-register-service';
import { createSystemRouter } from '../systems/system-router';

const num = (field: string, min: number, max: number, unit = '') =>
  z
    .number({ error: `${field} must be a number` })
    .min(min, `${field} must be at least ${min}${unit}`)
    .max(max, `${field} must be at most ${max}${unit}`);
const positive = (field: string, max: number, unit = '') =>
  num(field, 0, max, unit).positive(`${field} must be above 0${unit}`);
const name = z
  .string({ error: 'name is required' })
  .trim()
  .min(1, 'name is required')
  .max(120, 'name must be at most 120 characters')
  .regex(/^[^\p{Cc}]*$/u, 'name must not contain control characters');
const use = {
  hoursPerDay: num('hoursPerDay', 0, 24, ' h'),
  dutyCycle: num('dutyCycle', 0, 1),
  ac: z.boolean({ error: 'ac must be true or false' }),
  amps: positive('amps', 1000, ' A').optional(),
  watts: positive('watts', 20000, ' W').optional(),
};

const ratings = z.discriminatedUnion(
  'kind',
  [
    z.object({
      kind: z.literal('battery'),
      chemistry: z.enum(['lifepo4', 'agm', 'flooded'], {
        error: 'chemistry must be lifepo4, agm or flooded',
      }),
      capacityAh: positive('capacityAh', 20000, ' Ah'),
      bmsContinuousA: positive('bmsContinuousA', 2000, ' A'),
      bmsPeakA: positive('bmsPeakA', 10000, ' A').optional(),
      bmsPeakSeconds: positive('bmsPeakSeconds', 600, ' s').optional(),
    }),
    z.object({
      kind: z.literal('charge-source'),
      sourceKind: z.enum(['dc-dc', 'solar', 'shore', 'alternator', 'other'], {
        error: 'sourceKind must be dc-dc, solar, shore, alternator or other',
      }),
      ratedCurrentA: positive('ratedCurrentA', 1000, ' A'),
      monitorSourceId: z
        .string()
        .regex(/^[a-z0-9][a-z0-9-]{0,31}$/, 'monitorSourceId is the source id the monitor reports')
        .optional(),
      panelWatts: positive('panelWatts', 20000, ' W').optional(),
      hoursPerDay: num('hoursPerDay', 0, 24, ' h'),
    }),
    z.object({
      kind: z.literal('inverter'),
      continuousW: positive('continuousW', 20000, ' W'),
      surgeW: positive('surgeW', 60000, ' W'),
      standbyW: num('standbyW', 0, 1000, ' W'),
      efficiency: num('efficiency', 0.5, 1),
    }),
    z.object({ kind: z.enum(['heater', 'fridge', 'load']), ...use }),
  ],
  { error: 'ratings.kind must be battery, charge-source, inverter, heater, fridge or load' },
);

const componentBody = z.object({ name, ratings });

const circuitBody = z
  .object({
    name,
    componentId: z.string({ error: 'componentId is required' }).uuid('componentId must name a component'),
    conductor: z.object(
      {
        awg: z.enum(AWG_SIZES, { error: `conductor.awg must be one of ${AWG_SIZES.join(', ')}` }).optional(),
        mm2: positive('conductor.mm2', 500, ' mm²').optional(),
      },
      { error: 'conductor must give awg or mm2' },
    ),
    construction: z.enum(['stranded', 'fine-stranded', 'solid'], {
      error: 'construction must be stranded, fine-stranded or solid',
    }),
    oneWayLengthM: positive('oneWayLengthM', 100, ' m'),
    insulationRatingC: z.union([z.literal(60), z.literal(75), z.literal(90), z.literal(105)], {
      error: 'insulationRatingC must be 60, 75, 90 or 105',
    }),
    location: z.enum(['general', 'engine-space'], { error: 'location must be general or engine-space' }),
    ambientC: num('ambientC', -40, 100, ' °C'),
    bundledConductors: z
      .number({ error: 'bundledConductors must be a number' })
      .int('bundledConductors must be a whole number')
      .min(1, 'bundledConductors must be at least 1')
      .max(100, 'bundledConductors must be at most 100'),
    protection: z.object(
      {
        device: z.enum(['fuse', 'breaker'], { error: 'protection.device must be fuse or breaker' }),
        ratingA: positive('protection.ratingA', 1000, ' A'),
        type: z.string().trim().max(40, 'protection.type must be at most 40 characters').default(''),
      },
      { error: 'protection must give device and ratingA' },
    ),
    fuseDistanceM: num('fuseDistanceM', 0, 100, ' m').nullable(),
    sheathed: z.boolean({ error: 'sheathed must be true or false' }),
    designCurrentA: positive('designCurrentA', 1000, ' A').nullable(),
    allowedDropPercent: positive('allowedDropPercent', 20, ' %'),
    monitoring: z.enum(['battery-feed', 'source', 'none'], {
      error: 'monitoring must be battery-feed, source or none',
    }),
  })
  .refine((c) => (c.conductor.awg === undefined) !== (c.conductor.mm2 === undefined), {
    path: ['conductor'],
    message: 'conductor must give either awg or mm2, not both',
  });

/** Parses a body, naming every wrong field in the message and the first in `field`. */
function parse<T>(schema: z.ZodType<T>, body: unknown): T {
  const result = schema.safeParse(body ?? {});
  if (result.success) return result.data;
  const issues = result.error.issues.map((i) => ({ field: i.path.join('.'), message: i.message }));
  const message = issues.map((i) => (i.message.startsWith(i.field) ? i.message : `${i.field}: ${i.message}`));
  throw invalidInput(issues[0].field, message.join('; '));
}

/** The install register under /api/systems/:systemId/install. */
export function createInstallRegisterRoutes(deps: {
  register: InstallRegisterService;
  measured: DesignVsMeasuredService;
}): Router {
  const router = createSystemRouter();
  const base = '/:systemId/install';
  router.get(base, async (req, res) => {
    res.json({ register: await deps.register.get(req.currentUser!, req.params.systemId) });
  });
  router.post(`${base}/components`, async (req, res) => {
    const body = parse(componentBody, req.body);
    const component = await deps.register.addComponent(
      req.currentUser!,
      req.params.systemId,
      body.name,
      body.ratings as ComponentRatings,
    );
    res.status(201).json({ component });
  });
  router.put(`${base}/components/:componentId`, async (req, res) => {
    const body = parse(componentBody, req.body);
    const component = await deps.register.updateComponent(
      req.currentUser!,
      req.params.systemId,
      req.params.componentId,
      body.name,
      body.ratings as ComponentRatings,
    );
    res.json({ component });
  });
  router.delete(`${base}/components/:componentId`, async (req, res) => {
    await deps.register.removeComponent(req.currentUser!, req.params.systemId, req.params.componentId);
    res.status(204).end();
  });
  router.post(`${base}/circuits`, async (req, res) => {
    const wiring = parse(circuitBody, req.body) as CircuitWiring;
    res.status(201).json({
      circuit: await deps.register.addCircuit(req.currentUser!, req.params.systemId, wiring),
    });
  });
  router.put(`${base}/circuits/:circuitId`, async (req, res) => {
    const wiring = parse(circuitBody, req.body) as CircuitWiring;
    res.json({
      circuit: await deps.register.updateCircuit(
        req.currentUser!,
        req.params.systemId,
        req.params.circuitId,
        wiring,
      ),
    });
  });
  router.delete(`${base}/circuits/:circuitId`, async (req, res) => {
    await deps.register.removeCircuit(req.currentUser!, req.params.systemId, req.params.circuitId);
    res.status(204).end();
  });
  router.get(`${base}/measured`, async (req, res) => {
    const { days } = parse(
      z.object({
        days: z.coerce
          .number({ error: 'days must be a number' })
          .int('days must be a whole number')
          .min(1, 'days must be at least 1')
          .max(MAX_WINDOW_DAYS, `days must be at most ${MAX_WINDOW_DAYS}`)
          .default(DEFAULT_WINDOW_DAYS),
      }),
      req.query,
    );
    res.json({ circuits: await deps.measured.compare(req.currentUser!, req.params.systemId, days) });
  });
  return router;
}

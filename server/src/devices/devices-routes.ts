import type { Router } from 'express';
import { z } from 'zod';
import { DEVICE_ID_PATTERN, type DevicesService } from './devices-service';
import { createSystemRouter } from '../systems/system-router';

const deviceBody = z.object({
  id: z
    .string({ error: 'id is required' })
    .regex(
      DEVICE_ID_PATTERN,
      'id must be 3–63 lowercase letters, digits or dashes, starting with a letter or digit',
    ),
  label: z
    .string({ error: 'label is required' })
    .trim()
    .min(1, 'label is required')
    .max(80, 'label must be at most 80 characters')
    .regex(/^[^\p{Cc}]*$/u, 'label must not contain control characters'),
});

/** Devices of one system under /api/systems. */
export function createDevicesRoutes(devices: DevicesService): Router {
  const router = createSystemRouter();
  router.get('/:systemId/devices', async (req, res) => {
    res.json({ devices: await devices.list(req.currentUser!, req.params.systemId) });
  });
  router.post('/:systemId/devices', async (req, res) => {
    const body = deviceBody.parse(req.body ?? {});
    res.status(201).json(await devices.add(req.currentUser!, req.params.systemId, body.id, body.label));
  });
  router.post('/:systemId/devices/:deviceId/rotate', async (req, res) => {
    res.json(await devices.rotate(req.currentUser!, req.params.systemId, req.params.deviceId));
  });
  router.delete('/:systemId/devices/:deviceId', async (req, res) => {
    await devices.revoke(req.currentUser!, req.params.systemId, req.params.deviceId);
    res.status(204).end();
  });
  return router;
}

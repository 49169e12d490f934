import type { CommissioningCheck } from '@cellwarden/shared';
import { toRecordCheck } from './commissioning-record-input';

const check: CommissioningCheck = {
  id: 'c1',
  systemId: 's1',
  sourceId: 'solar',
  ratedCurrentA: 30,
  tolerancePercent: 10,
  status: 'failed',
  progress: { phase: 'done', secondsMeasured: 300, secondsNeeded: 300 },
  startedAt: 0,
  finishedAt: 300_000,
  installer: { id: 'u1', displayName: 'Sam Field' },
  result: {
    meanCurrentA: 24.5,
    minCurrentA: 23.9,
    maxCurrentA: 25.1,
    ripplePeakToPeakA: 1.2,
    batteryVoltageReached: 13.4,
    cableDropV: null,
    reasons: ['Mean current 24.5 A is below 27 A'],
  },
};

describe('toRecordCheck', () => {
  it('maps a finished check to a record line with its source label and verdict', () => {
    expect(toRecordCheck(check, [{ id: 'solar', label: 'Roof solar' }])).toEqual({
      source: 'Roof solar',
      ratedCurrentA: 30,
      tolerancePercent: 10,
      windowSeconds: 300,
      meanCurrentA: 24.5,
      minCurrentA: 23.9,
      maxCurrentA: 25.1,
      ripplePeakToPeakA: 1.2,
      batteryVoltageReached: 13.4,
      cableDropV: null,
      verdict: 'FAIL',
      reasons: ['Mean current 24.5 A is below 27 A'],
      startedAt: 0,
      finishedAt: 300_000,
    });
  });

  it('falls back to the source id and passes a passed check', () => {
    expect(toRecordCheck({ ...check, status: 'passed' }, [])).toMatchObject({
      source: 'solar',
      verdict: 'PASS',
    });
  });

  it.each(['running', 'abandoned'] as const)('leaves out a %s check', (status) => {
    expect(toRecordCheck({ ...check, status }, [])).toBeNull();
  });
});

import { compareWithRatings, type CircuitDesignVsMeasured } from '@cellwarden/shared';
import { TemperatureUnit, inUnit } from '../../core/temperature-unit';

/**
 * The server's comparison worded again with the conductor's rating in the viewer's unit: the same shared
 * function, fed the figures and limits the server measured and compared.
 */
export function measuredSentence(circuit: CircuitDesignVsMeasured, unit: TemperatureUnit): string {
  if (unit === 'C' || circuit.comparisons.length === 0) return circuit.sentence;
  const limit = (rating: string) => circuit.comparisons.find((c) => c.rating === rating)?.limitA;
  return compareWithRatings(
    circuit.circuitName,
    { samples: circuit.samples, peakA: circuit.peakA, peakSeconds: circuit.peakSeconds, p99A: circuit.p99A },
    {
      fuseA: limit('fuse') ?? 0,
      protectionDevice: circuit.protectionDevice,
      conductorA: limit('conductor') ?? null,
      insulationRatingC: circuit.insulationRatingC,
      bmsContinuousA: limit('bms-continuous'),
      bmsPeakA: limit('bms-peak'),
    },
    (celsius) => `${Math.round(inUnit(celsius, unit))} °${unit}`,
  ).sentence;
}

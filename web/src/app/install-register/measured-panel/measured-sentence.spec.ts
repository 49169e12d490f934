import type { CircuitDesignVsMeasured } from '@cellwarden/shared';
import { measuredSentence } from './measured-sentence';

const feed: CircuitDesignVsMeasured = {
  circuitId: 'c',
  circuitName: 'Inverter feed',
  samples: 600,
  windowFrom: 0,
  windowTo: 1,
  peakA: 181,
  peakAt: 0,
  peakSeconds: 4,
  p99A: 120,
  comparisons: [
    { rating: 'fuse', limitA: 250, measuredA: 181, measure: 'peak', standing: 'within' },
    { rating: 'conductor', limitA: 245, measuredA: 120, measure: 'p99', standing: 'within' },
    { rating: 'bms-continuous', limitA: 200, measuredA: 120, measure: 'p99', standing: 'within' },
  ],
  insulationRatingC: 105,
  protectionDevice: 'fuse',
  standing: 'within',
  sentence:
    'Inverter feed peaked at 181 A for 4 s, 99 % of the time at or below 120 A — fuse 250 A, conductor 245 A at 105 °C, BMS 200 A continuous: within limits',
};

describe('measured sentence', () => {
  it("keeps the server's words in °C and words the conductor's rating in °F for a °F viewer", () => {
    expect(measuredSentence(feed, 'C')).toBe(feed.sentence);
    // °F = °C × 9/5 + 32: 105 °C is 221 °F
    expect(measuredSentence(feed, 'F')).toBe(feed.sentence.replace('105 °C', '221 °F'));
  });
});

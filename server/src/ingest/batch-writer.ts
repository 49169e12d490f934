import type { Logger } from '../logger';
import type { ReadingRow, ReadingsRepository } from '../telemetry/readings-repository';

interface Pending {
  row: ReadingRow;
  settle: (error?: Error) => void;
}

/** One system's readings always go through the same lane, so they are stored in the order they came. */
interface Lane {
  queue: Pending[];
  flushing: boolean;
  kicked: boolean;
  retryTimer?: NodeJS.Timeout;
  retryDelayMs: number;
}

/** Queue full: the database has been away long enough that holding more would risk memory. */
export class IngestQueueFullError extends Error {
  readonly code = 'ingest_queue_full';
}

// Back-off while PostgreSQL is slow or away: from `retryMs`, doubling up to this.
const MAX_RETRY_DELAY_MS = 5000;

/** FNV-1a: a cheap, stable spread of system ids over the lanes. */
function laneIndex(systemId: string, lanes: number): number {
  let hash = 0x811c9dc5;
  for (let i = 0; i < systemId.length; i++) hash = Math.imul(hash ^ systemId.charCodeAt(i), 0x01000193);
  return (hash >>> 0) % lanes;
}

/**
 * Writes readings in batches that adapt to the load: a lane with nothing in flight writes what is waiting at
 * once (within the same turn of the event loop, so one pack is one batch), and while a write is in flight the
 * next batch gathers, up to `batchSize`. Quiet means a reading is stored in one round of transactions; busy
 * means large batches back to back. Systems are spread over `lanes` lanes writing concurrently.
 * While PostgreSQL is slow or away the queue holds (bounded) and each lane retries with back-off; each
 * caller's promise settles only once its reading is committed, so a QoS 1 PUBACK means stored.
 */
export function createBatchWriter(deps: {
  repository: ReadingsRepository;
  logger: Logger;
  batchSize: number;
  /** First delay before a failed batch is tried again. */
  retryMs: number;
  queueLimit: number;
  /** Concurrent writers; 2 keeps a 2-vCPU PostgreSQL busy without queueing on its locks. */
  lanes?: number;
  onStored: (rows: readonly ReadingRow[]) => void;
}) {
  const lanes: Lane[] = Array.from({ length: deps.lanes ?? 2 }, () => ({
    queue: [],
    flushing: false,
    kicked: false,
    retryDelayMs: deps.retryMs,
  }));
  let queued = 0;
  let closed = false;

  function kick(lane: Lane) {
    if (closed || lane.flushing || lane.kicked || lane.retryTimer) return;
    lane.kicked = true;
    setImmediate(() => {
      lane.kicked = false;
      void flush(lane);
    });
  }

  async function flush(lane: Lane): Promise<void> {
    lane.retryTimer = undefined;
    if (closed || lane.flushing || lane.queue.length === 0) return;
    lane.flushing = true;
    const batch = lane.queue.slice(0, deps.batchSize);
    let failed = false;
    try {
      const stored = await deps.repository.insertBatch(batch.map((p) => p.row));
      // After close() the queue was emptied (and its callers told) already.
      if (!closed) {
        lane.queue.splice(0, batch.length);
        queued -= batch.length;
      }
      lane.retryDelayMs = deps.retryMs;
      // Only newly stored readings go live: a redelivered duplicate must not be announced (or flagged) twice.
      if (stored.length > 0) announce(stored);
      for (const p of batch) p.settle();
    } catch (error) {
      failed = true;
      deps.logger.warn('reading batch not stored yet; will retry', {
        error: (error as Error).message,
        queued,
      });
    } finally {
      lane.flushing = false;
    }
    if (lane.queue.length === 0 || closed) return;
    if (!failed) return kick(lane);
    lane.retryTimer = setTimeout(() => void flush(lane), lane.retryDelayMs);
    lane.retryDelayMs = Math.min(lane.retryDelayMs * 2, MAX_RETRY_DELAY_MS);
  }

  function announce(stored: readonly ReadingRow[]) {
    try {
      deps.onStored(stored);
    } catch (error) {
      // Stored is stored: a failing listener must not make the batch look unwritten.
      deps.logger.error('stored readings not announced', { error: (error as Error).message });
    }
  }

  return {
    /** Resolves once the rows are committed; rejects at once when the queue is full. */
    write(rows: readonly ReadingRow[]): Promise<void> {
      if (queued + rows.length > deps.queueLimit) {
        return Promise.reject(new IngestQueueFullError(`ingest queue full (${queued} readings waiting)`));
      }
      const settled = rows.map((row) => {
        const lane = lanes[laneIndex(row.systemId, lanes.length)];
        return new Promise<void>((resolve, reject) => {
          lane.queue.push({ row, settle: (error) => (error ? reject(error) : resolve()) });
          queued++;
          kick(lane);
        });
      });
      return Promise.all(settled).then(() => undefined);
    },
    get queued() {
      return queued;
    },
    /** Stops writing; readings still queued are not acknowledged and will be redelivered. */
    close() {
      closed = true;
      for (const lane of lanes) {
        if (lane.retryTimer) clearTimeout(lane.retryTimer);
        for (const p of lane.queue.splice(0)) p.settle(new Error('ingest stopped'));
      }
      queued = 0;
    },
  };
}

export type BatchWriter = ReturnType<typeof createBatchWriter>;

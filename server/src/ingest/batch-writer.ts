import type { Logger } from '../logger';
import type { ReadingRow, ReadingsRepository } from '../telemetry/readings-repository';

/** One caller's rows (a pack, usually): its promise settles once every row is committed, or at the first failure. */
interface Ticket {
  left: number;
  settled: boolean;
  resolve: () => void;
  reject: (error: Error) => void;
}

/** One system's readings always go through the same lane, so they are stored in the order they came. */
interface Lane {
  /** The rows waiting, and beside each the ticket of the caller it came from (no object per reading). */
  queue: ReadingRow[];
  tickets: Ticket[];
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
    tickets: [],
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
    const tickets = lane.tickets.slice(0, batch.length);
    let failed = false;
    try {
      const stored = await deps.repository.insertBatch(batch);
      // After close() the queue was emptied (and its callers told) already.
      if (!closed) {
        lane.queue.splice(0, batch.length);
        lane.tickets.splice(0, batch.length);
        queued -= batch.length;
      }
      lane.retryDelayMs = deps.retryMs;
      // Only newly stored readings go live: a redelivered duplicate must not be announced (or flagged) twice.
      if (stored.length > 0) announce(stored);
      for (const ticket of tickets) settle(ticket);
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

  function settle(ticket: Ticket, error?: Error) {
    if (ticket.settled) return;
    if (error) {
      ticket.settled = true;
      ticket.reject(error);
    } else if (--ticket.left === 0) {
      ticket.settled = true;
      ticket.resolve();
    }
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
      if (rows.length === 0) return Promise.resolve();
      // One promise per caller, not one per reading; a pack's rows are of one system, so one lane is looked up.
      return new Promise<void>((resolve, reject) => {
        const ticket: Ticket = { left: rows.length, settled: false, resolve, reject };
        let systemId: string | undefined;
        let lane = lanes[0];
        for (const row of rows) {
          if (row.systemId !== systemId) {
            systemId = row.systemId;
            lane = lanes[laneIndex(systemId, lanes.length)];
          }
          lane.queue.push(row);
          lane.tickets.push(ticket);
          queued++;
          kick(lane);
        }
      });
    },
    get queued() {
      return queued;
    },
    /** Stops writing; readings still queued are not acknowledged and will be redelivered. */
    close() {
      closed = true;
      for (const lane of lanes) {
        if (lane.retryTimer) clearTimeout(lane.retryTimer);
        const stopped = new Error('ingest stopped');
        lane.queue.length = 0;
        for (const ticket of lane.tickets.splice(0)) settle(ticket, stopped);
      }
      queued = 0;
    },
  };
}

export type BatchWriter = ReturnType<typeof createBatchWriter>;

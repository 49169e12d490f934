import type { Logger } from '../logger';
import type { ReadingRow, ReadingsRepository } from '../telemetry/readings-repository';

interface Pending {
  row: ReadingRow;
  settle: (error?: Error) => void;
}

/** Queue full: the database has been away long enough that holding more would risk memory. */
export class IngestQueueFullError extends Error {
  readonly code = 'ingest_queue_full';
}

/**
 * Writes readings in batches: flushed when `batchSize` are waiting or `flushMs` after the first.
 * While PostgreSQL is slow or away the queue holds (bounded) and the flush retries with back-off;
 * each caller's promise settles only once its reading is committed, so a QoS 1 PUBACK means stored.
 */
export function createBatchWriter(deps: {
  repository: ReadingsRepository;
  logger: Logger;
  batchSize: number;
  flushMs: number;
  queueLimit: number;
  onStored: (rows: readonly ReadingRow[]) => void;
}) {
  const queue: Pending[] = [];
  let timer: NodeJS.Timeout | undefined;
  let flushing = false;
  let retryDelayMs = 100;
  let closed = false;

  function schedule(delayMs: number) {
    if (!timer && !closed) timer = setTimeout(() => void flush(), delayMs);
  }

  async function flush(): Promise<void> {
    timer = undefined;
    if (flushing || queue.length === 0) return;
    flushing = true;
    const batch = queue.slice(0, deps.batchSize);
    try {
      const stored = await deps.repository.insertBatch(batch.map((p) => p.row));
      queue.splice(0, batch.length);
      retryDelayMs = 100;
      // Only newly stored readings go live: a redelivered duplicate must not be announced (or flagged) twice.
      if (stored.length > 0) deps.onStored(stored);
      for (const p of batch) p.settle();
    } catch (error) {
      deps.logger.warn('reading batch not stored yet; will retry', {
        error: (error as Error).message,
        queued: queue.length,
      });
      retryDelayMs = Math.min(retryDelayMs * 2, 5000);
    } finally {
      flushing = false;
    }
    if (queue.length >= deps.batchSize) schedule(0);
    else if (queue.length > 0) schedule(retryDelayMs > 100 ? retryDelayMs : deps.flushMs);
  }

  return {
    /** Resolves once the row is committed; rejects at once when the queue is full. */
    write(rows: readonly ReadingRow[]): Promise<void> {
      if (queue.length + rows.length > deps.queueLimit) {
        return Promise.reject(
          new IngestQueueFullError(`ingest queue full (${queue.length} readings waiting)`),
        );
      }
      const settled = rows.map(
        (row) =>
          new Promise<void>((resolve, reject) => {
            queue.push({ row, settle: (error) => (error ? reject(error) : resolve()) });
          }),
      );
      if (queue.length >= deps.batchSize) schedule(0);
      else schedule(deps.flushMs);
      return Promise.all(settled).then(() => undefined);
    },
    get queued() {
      return queue.length;
    },
    /** Stops scheduling; readings still queued are not acknowledged and will be redelivered. */
    close() {
      closed = true;
      if (timer) clearTimeout(timer);
      for (const p of queue.splice(0)) p.settle(new Error('ingest stopped'));
    },
  };
}

export type BatchWriter = ReturnType<typeof createBatchWriter>;

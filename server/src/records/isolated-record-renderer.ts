import path from 'node:path';
import { Worker } from 'node:worker_threads';
import { AppError } from '../errors/app-error';
import type { CommissioningRecordInput } from './commissioning-record-input';

/** Bounds of one record render; the defaults are what the server uses (stated in DEVELOPERS.md). */
export interface RecordRenderLimits {
  /** Wall-clock limit of one render, ms; the thread is terminated after it (default 20 s). */
  timeoutMs?: number;
  /** V8 old-generation heap of the rendering thread, MB (default 128). */
  heapMb?: number;
  /** Renders running at once (default 2: one per core of the smallest supported machine). */
  maxRunning?: number;
  /** Renders waiting for a turn; beyond that a request is answered 503 at once (default 8). */
  maxWaiting?: number;
}

/** Renders a commissioning record to PDF bytes, isolated from the server process. */
export interface RecordRenderer {
  render(record: CommissioningRecordInput): Promise<Buffer>;
}

const WORKER_ENTRY = path.join(__dirname, 'record-render-worker.cjs');

/**
 * Each render runs in its own worker thread with a heap limit and a time limit: a record that throws inside
 * pdfkit, outgrows the heap or takes too long ends that thread and answers that one request with an error,
 * while the server goes on. A small queue keeps simultaneous renders from multiplying the memory bound.
 */
export function createRecordRenderer(limits: RecordRenderLimits = {}): RecordRenderer {
  return createIsolatedPdfRenderer<CommissioningRecordInput>(WORKER_ENTRY, 'commissioning record', limits);
}

/** The same isolation for any PDF whose worker entry posts the bytes back (`what` names it in errors). */
export function createIsolatedPdfRenderer<T>(
  workerEntry: string,
  what: string,
  limits: RecordRenderLimits = {},
): { render(input: T): Promise<Buffer> } {
  const timeoutMs = limits.timeoutMs ?? 20_000;
  const heapMb = limits.heapMb ?? 128;
  const maxRunning = limits.maxRunning ?? 2;
  const maxWaiting = limits.maxWaiting ?? 8;
  let running = 0;
  const waiting: (() => void)[] = [];

  const turn = (): Promise<void> => {
    if (running < maxRunning) {
      running++;
      return Promise.resolve();
    }
    if (waiting.length >= maxWaiting) return Promise.reject(renderBusy(what));
    return new Promise((resolve) => waiting.push(resolve));
  };
  const done = () => {
    const next = waiting.shift();
    if (next) next();
    else running--;
  };

  return {
    async render(input) {
      await turn();
      try {
        return await renderInThread(workerEntry, what, input, timeoutMs, heapMb);
      } finally {
        done();
      }
    },
  };
}

function renderInThread(
  workerEntry: string,
  what: string,
  input: unknown,
  timeoutMs: number,
  heapMb: number,
): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const worker = new Worker(workerEntry, {
      workerData: input,
      resourceLimits: { maxOldGenerationSizeMb: heapMb, maxYoungGenerationSizeMb: 16, stackSizeMb: 4 },
    });
    let settled = false;
    const settle = (outcome: () => void) => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      outcome();
      void worker.terminate();
    };
    const timer = setTimeout(
      () => settle(() => reject(renderFailed(what, `it took longer than ${timeoutMs / 1000} s`))),
      timeoutMs,
    );
    worker.once('message', (bytes: Uint8Array) =>
      settle(() => resolve(Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength))),
    );
    worker.once('error', (error) => settle(() => reject(renderFailed(what, error.message, error))));
    worker.once('exit', (code) =>
      settle(() => reject(renderFailed(what, `the rendering thread exited with ${code}`))),
    );
  });
}

function renderFailed(what: string, reason: string, cause?: unknown): AppError {
  return new AppError(
    'record_render_failed',
    500,
    `The ${what} could not be made (${reason.slice(0, 200)}); the rest of the service is unaffected`,
    undefined,
    { cause },
  );
}

function renderBusy(what: string): AppError {
  return new AppError('record_render_busy', 503, `Too many ${what}s are being made; try again shortly`);
}

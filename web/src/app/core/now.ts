import { DestroyRef, inject, signal } from '@angular/core';

/** A signal holding Date.now(), refreshed every `periodMs`; call in an injection context. */
export function injectNow(periodMs = 15_000) {
  const now = signal(Date.now());
  const handle = setInterval(() => now.set(Date.now()), periodMs);
  inject(DestroyRef).onDestroy(() => clearInterval(handle));
  return now.asReadonly();
}

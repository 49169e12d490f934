import { HttpResponse, type HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import type { SystemStatus, SystemSummary } from '@cellwarden/shared';
import { tap } from 'rxjs';
import { OfflineStore } from './offline-store';

const SYSTEMS = /^\/api\/systems$/;
const STATUS = /^\/api\/systems\/[^/]+\/status$/;

/** Keeps the last systems list and each system's last status as they arrive, for the offline view. */
export const offlineCopyInterceptor: HttpInterceptorFn = (req, next) => {
  const path = req.url.split('?')[0];
  if (req.method !== 'GET' || !(SYSTEMS.test(path) || STATUS.test(path))) return next(req);
  const store = inject(OfflineStore);
  return next(req).pipe(
    tap((event) => {
      if (!(event instanceof HttpResponse) || !event.ok || !event.body) return;
      if (SYSTEMS.test(path)) store.recordSystems((event.body as { systems: SystemSummary[] }).systems);
      else store.recordStatus((event.body as { status: SystemStatus }).status);
    }),
  );
};

import type { Role } from '@cellwarden/shared';

export type { ApiErrorBody, HistoryPoint, ReceivedReading, SystemSummary } from '@cellwarden/shared';

/** A user as the auth endpoints return it. */
export interface User {
  id: string;
  email: string;
  displayName: string;
  roles: Role[];
}

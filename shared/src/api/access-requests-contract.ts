// Shapes of support people asking an owner for access (/api/access-requests, /api/systems/:id/share-codes).
import type { GrantAccess } from './access-contract';

/** POST /api/access-requests body: the owner's address and the system's name, or a share code. */
export type NewAccessRequest =
  { ownerEmail: string; systemName: string; note?: string } | { shareCode: string; note?: string };

/** A request as the support person who made it sees it: only what they typed, never what it matched. */
export interface OutgoingAccessRequest {
  id: string;
  via: 'owner-and-name' | 'share-code';
  ownerEmail: string | null;
  systemName: string | null;
  createdAt: number;
  expiresAt: number;
  /** `pending` until the owner answers or it expires; a request that matched nothing stays pending until then. */
  state: 'pending' | 'approved' | 'declined' | 'expired';
}

/** A pending request as the owner sees it (GET /api/access-requests/incoming, .../systems/:id/access-requests). */
export interface IncomingAccessRequest {
  id: string;
  systemId: string;
  systemName: string;
  requester: { email: string; displayName: string; companyName: string | null };
  via: 'owner-and-name' | 'share-code';
  note: string;
  createdAt: number;
  expiresAt: number;
}

/** POST /api/access-requests/:id/approve body; the grant goes to the requester by their address. */
export interface AccessRequestApproval {
  access: GrantAccess;
  /** ISO 8601 time in the future, within a year. */
  expiresAt: string;
}
// POST /api/access-requests/:id/decline (204).

/** POST /api/systems/:id/share-codes answer (201): shown once, used once, short-lived. */
export interface ShareCode {
  /** Eight characters in two groups, e.g. "K7QM-2XHD". */
  code: string;
  expiresAt: number;
}

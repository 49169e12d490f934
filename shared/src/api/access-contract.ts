// Shapes of grants, device credentials and the audit trail (/api/systems/:id/...).

/** What a grant allows. */
export type GrantAccess = 'view' | 'configure';

/** One grant of access to one system, as the owner (GET /api/systems/:id/grants) and the grantee see it. */
export interface Grant {
  id: string;
  systemId: string;
  systemName: string;
  access: GrantAccess;
  /** Exactly one of the two is set. */
  granteeCompany: { id: string; name: string } | null;
  granteeUser: { id: string; email: string; displayName: string } | null;
  grantedBy: { id: string; displayName: string };
  createdAt: number;
  expiresAt: number;
  revokedAt: number | null;
  /** Active = not revoked and not expired, now. */
  active: boolean;
}

/** POST /api/systems/:id/grants body (owner only): either a company or a person by e-mail. */
export interface GrantRequest {
  granteeCompanyId?: string;
  granteeEmail?: string;
  access: GrantAccess;
  /** ISO 8601 time in the future. */
  expiresAt: string;
}
// DELETE /api/systems/:id/grants/:grantId revokes (204). GET /api/grants/received lists Grant[] given to me or my company.

/** A battery monitor attached to a system (GET /api/systems/:id/devices). */
export interface DeviceListing {
  id: string;
  label: string;
  createdAt: number;
  lastSeenAt: number | null;
  revokedAt: number | null;
}

/** POST /api/systems/:id/devices body (owner, or installer of the system's company). */
export interface DeviceRequest {
  /** Lowercase letters, digits and dashes, 3 to 63 characters, starting with a letter or digit. */
  id: string;
  label: string;
}

/**
 * Shown exactly once, when a device is added (201) or its secret rotated
 * (POST /api/systems/:id/devices/:deviceId/rotate); only a hash is stored.
 * DELETE /api/systems/:id/devices/:deviceId revokes (204).
 */
export interface DeviceCredentials {
  device: DeviceListing;
  mqttUsername: string;
  mqttPassword: string;
  mqttTopic: string;
  brokerPort: number;
  /** Where monitors reach the broker (MQTT_PUBLIC_URL, or the node's own address and port). */
  brokerUrl: string;
}

/** What an audit entry records. */
export type AuditAction =
  | 'system.viewed'
  | 'readings.viewed'
  | 'readings.exported'
  | 'system.changed'
  | 'grant.created'
  | 'grant.revoked'
  | 'device.added'
  | 'device.rotated'
  | 'device.revoked'
  | 'alert.acknowledged'
  | 'commissioning.recorded'
  | 'system.created'
  | 'ownership.offered'
  | 'ownership.accepted'
  | 'installer.removed'
  | 'share-code.created'
  | 'access.requested'
  | 'access.approved'
  | 'access.declined';

/** One entry of GET /api/systems/:id/audit (owner, and installer/admin of the system's company). */
export interface AuditEntry {
  id: string;
  at: number;
  actor: { id: string; displayName: string; email: string } | null;
  action: AuditAction;
  /** A short human-readable detail, e.g. the grantee or the range viewed. */
  detail: string;
}

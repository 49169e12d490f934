import type { AuditAction } from '@cellwarden/shared';

const LABELS: Record<AuditAction, string> = {
  'system.viewed': 'Opened the system',
  'readings.viewed': 'Viewed readings',
  'readings.exported': 'Exported readings',
  'system.changed': 'Changed settings',
  'grant.created': 'Granted access',
  'grant.revoked': 'Revoked access',
  'device.added': 'Added a device',
  'device.rotated': 'Rotated a device secret',
  'device.revoked': 'Revoked a device',
  'alert.acknowledged': 'Acknowledged an alert',
  'commissioning.recorded': 'Recorded a commissioning check',
  'system.created': 'Set up the system',
  'ownership.offered': 'Offered the system to its owner',
  'ownership.accepted': 'Accepted ownership',
  'installer.removed': "Ended the installer company's rights",
  'share-code.created': 'Made a share code',
  'access.requested': 'Asked for access',
  'access.approved': 'Approved an access request',
  'access.declined': 'Declined an access request',
};

/** An audit action in plain words. */
export function auditActionLabel(action: AuditAction): string {
  return LABELS[action] ?? action;
}

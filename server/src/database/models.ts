// The one place the Sequelize models are bound to a connection and associated. The schema comes only from
// the migrations (db/migrations); nothing here calls `sync()`. Keys and timestamps default to the database's
// gen_random_uuid() and now(), as the columns do, so every time in these tables is on the database's clock.
import type { Model, ModelStatic, Sequelize } from 'sequelize';
import { defineAccountModels } from '../accounts/account-models';
import { defineLinkModels } from '../accounts/link-models';
import { defineSessionModels } from '../accounts/session-models';
import { defineAuditModels } from '../audit/audit-entry-model';
import { definePreferenceModels } from '../settings/user-preference-model';
import { defineInstallRegisterModels } from '../install-register/install-register-models';
import { defineSystemModels } from '../systems/system-model';
import { defineGrantModels } from '../access/grant-model';
import { defineDeviceModels } from '../devices/device-model';
import { defineAlertModels } from '../alerts/alert-models';
import { defineInstallerModels } from '../installer/installer-models';
import { defineAccessRequestModels } from '../access-requests/access-request-models';
import { defineHandoverModels } from '../onboarding/handover-model';
import { defineBatteryHealthModels } from '../battery-health/battery-health-models';

function defineModels(sequelize: Sequelize) {
  const models = {
    ...defineAccountModels(sequelize),
    ...defineSessionModels(sequelize),
    ...defineLinkModels(sequelize),
    ...defineAuditModels(sequelize),
    ...definePreferenceModels(sequelize),
    ...defineInstallRegisterModels(sequelize),
    ...defineSystemModels(sequelize),
    ...defineGrantModels(sequelize),
    ...defineDeviceModels(sequelize),
    ...defineAlertModels(sequelize),
    ...defineInstallerModels(sequelize),
    ...defineAccessRequestModels(sequelize),
    ...defineHandoverModels(sequelize),
    ...defineBatteryHealthModels(sequelize),
  };
  const {
    Company,
    User,
    SignInSession,
    RefreshToken,
    Invitation,
    PasswordReset,
    AuditEntry,
    UserPreference,
  } = models;
  Company.hasMany(User, { as: 'members', foreignKey: 'companyId' });
  User.belongsTo(Company, { as: 'company', foreignKey: 'companyId' });
  User.hasMany(SignInSession, { as: 'signInSessions', foreignKey: 'userId' });
  SignInSession.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  User.hasMany(RefreshToken, { as: 'refreshTokens', foreignKey: 'userId' });
  RefreshToken.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  // A refresh-token family is one sign-in session (family_id = sign_in_sessions.id, not a declared key:
  // families from before the sessions table have no row).
  SignInSession.hasMany(RefreshToken, { as: 'refreshTokens', foreignKey: 'familyId', constraints: false });
  Company.hasMany(Invitation, { as: 'invitations', foreignKey: 'companyId' });
  Invitation.belongsTo(Company, { as: 'company', foreignKey: 'companyId' });
  User.hasMany(PasswordReset, { as: 'passwordResets', foreignKey: 'userId' });
  PasswordReset.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  AuditEntry.belongsTo(User, { as: 'actor', foreignKey: 'actorId' });
  User.hasOne(UserPreference, { as: 'preferences', foreignKey: 'userId' });
  UserPreference.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  // A component a circuit feeds is not removed before the circuit (RESTRICT in the migration too).
  models.InstallComponent.hasMany(models.InstallCircuit, { as: 'circuits', foreignKey: 'componentId' });
  models.InstallCircuit.belongsTo(models.InstallComponent, { as: 'component', foreignKey: 'componentId' });
  // A system belongs to its owner and, until the owner ends it, its installer company.
  const { System, AccessGrant, Device, SystemAlert, AlertNotice, CommissioningRun, Upload } = models;
  const { SavedBudget, ShareCode, AccessRequest, Handover, CapacitySampleRow, HealthCheckpointRow } = models;
  System.belongsTo(User, { as: 'owner', foreignKey: 'ownerId' });
  System.belongsTo(Company, { as: 'installerCompany', foreignKey: 'installerCompanyId' });
  // The rows kept per system: each is one system's (`systemId`), which reaches them under the name given.
  const perSystem: [ModelStatic<Model>, string][] = [
    [AccessGrant, 'grants'],
    [Device, 'devices'],
    [SystemAlert, 'alerts'],
    [CommissioningRun, 'commissioningChecks'],
    [Upload, 'uploads'],
    [SavedBudget, 'energyBudgets'],
    [ShareCode, 'shareCodes'],
    [Handover, 'handovers'],
    [CapacitySampleRow, 'capacitySamples'],
  ];
  for (const [rows, as] of perSystem) {
    System.hasMany(rows, { as, foreignKey: 'systemId' });
    rows.belongsTo(System, { as: 'system', foreignKey: 'systemId' });
  }
  System.hasOne(HealthCheckpointRow, { as: 'healthCheckpoint', foreignKey: 'systemId' });
  HealthCheckpointRow.belongsTo(System, { as: 'system', foreignKey: 'systemId' });
  // The people (and companies) a row names, each under the name of the part they played.
  AccessGrant.belongsTo(User, { as: 'granter', foreignKey: 'grantedBy' });
  AccessGrant.belongsTo(Company, { as: 'granteeCompany', foreignKey: 'granteeCompanyId' });
  AccessGrant.belongsTo(User, { as: 'granteeUser', foreignKey: 'granteeUserId' });
  SystemAlert.belongsTo(User, { as: 'acknowledger', foreignKey: 'acknowledgedBy' });
  SystemAlert.hasMany(AlertNotice, { as: 'notices', foreignKey: 'alertId' });
  AlertNotice.belongsTo(SystemAlert, { as: 'alert', foreignKey: 'alertId' });
  AlertNotice.belongsTo(User, { as: 'recipient', foreignKey: 'userId' });
  CommissioningRun.belongsTo(User, { as: 'installer', foreignKey: 'installerId' });
  Upload.belongsTo(User, { as: 'uploader', foreignKey: 'uploadedBy' });
  SavedBudget.belongsTo(User, { as: 'author', foreignKey: 'createdBy' });
  ShareCode.belongsTo(User, { as: 'creator', foreignKey: 'createdBy' });
  ShareCode.belongsTo(User, { as: 'claimer', foreignKey: 'usedBy' });
  AccessRequest.belongsTo(User, { as: 'requester', foreignKey: 'requesterId' });
  AccessRequest.belongsTo(Company, { as: 'requesterCompany', foreignKey: 'requesterCompanyId' });
  AccessRequest.belongsTo(System, { as: 'system', foreignKey: 'systemId' });
  AccessRequest.belongsTo(User, { as: 'decider', foreignKey: 'decidedBy' });
  AccessRequest.belongsTo(AccessGrant, { as: 'grant', foreignKey: 'grantId' });
  Handover.belongsTo(User, { as: 'offerer', foreignKey: 'offeredBy' });
  Handover.belongsTo(User, { as: 'acceptor', foreignKey: 'acceptedBy' });
  return models;
}

/** The models bound to one Sequelize instance. */
export type Models = ReturnType<typeof defineModels>;

const bound = new WeakMap<Sequelize, Models>();

/**
 * Binds the models to this Sequelize instance, once; later calls return the same set. Each instance gets its
 * own subclasses, so two nodes (or a primary and a replica) in one process never share a pool.
 */
export function initModels(sequelize: Sequelize): Models {
  let models = bound.get(sequelize);
  if (!models) {
    models = defineModels(sequelize);
    bound.set(sequelize, models);
  }
  return models;
}

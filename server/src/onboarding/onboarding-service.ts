import type {
  CreatedSystem,
  MonitorStatus,
  NewSystemRequest,
  PublicUser,
  SystemHandover,
} from '@cellwarden/shared';
import type { AccountLinksRepository } from '../accounts/account-links-repository';
import type { AccountsRepository } from '../accounts/accounts-repository';
import { INVITATION_TTL_MS } from '../accounts/invitations-service';
import { newOneTimeToken } from '../accounts/one-time-token';
import type { AuditService } from '../audit/audit-service';
import type { DeviceRefusals } from '../broker/device-refusals';
import { isUuid } from '../database/sql-values';
import type { DevicesRepository } from '../devices/devices-repository';
import { forbidden, invalidInput, notFound } from '../errors/app-error';
import type { Logger } from '../logger';
import type { Mailer } from '../mail/mailer';
import type { SystemsService } from '../systems/systems-service';
import { handoverInvitationMail, handoverToAccountMail } from './onboarding-mail';
import type { OnboardingRepository } from './onboarding-repository';

/** How long a system set up for a customer waits for them to accept it. */
export const HANDOVER_TTL_MS = 30 * 24 * 3600 * 1000;

/**
 * Setting up a system: an owner for themselves, or an installer for a customer. Until the customer accepts,
 * the installer who set it up holds it as its owner (someone must receive its alerts and may grant access);
 * acceptance moves ownership to the customer, and the installer company keeps installer rights until the
 * owner ends them.
 */
export function createOnboardingService(deps: {
  repository: OnboardingRepository;
  accounts: AccountsRepository;
  links: AccountLinksRepository;
  devices: DevicesRepository;
  refusals: DeviceRefusals;
  systems: SystemsService;
  audit: AuditService;
  mailer: Mailer;
  publicUrl: () => string;
  now: () => number;
  logger: Logger;
  /** Told when someone's rights on a system end (the live stream re-asks the policy). */
  onAccessRevoked?: (systemId: string) => void;
}) {
  // Which mail goes out depends on whether the address signs in; what the installer is told does not.
  async function offer(installer: PublicUser, systemId: string, systemName: string, email: string) {
    const company = installer.companyId ? await deps.accounts.findCompany(installer.companyId) : undefined;
    const words = { systemName, installerName: installer.displayName, companyName: company?.name ?? null };
    if (await deps.accounts.findByEmail(email)) {
      const link = `${deps.publicUrl()}/requests`;
      await deps.mailer.send({ to: email, ...handoverToAccountMail({ ...words, link }) });
      return;
    }
    const { token, hash } = newOneTimeToken();
    const expiresAt = new Date(deps.now() + INVITATION_TTL_MS);
    await deps.links.createInvitation({
      tokenHash: hash,
      email,
      roles: ['owner'],
      companyId: null,
      invitedBy: installer.id,
      expiresAt,
    });
    const link = `${deps.publicUrl()}/invitation/${token}`;
    await deps.mailer.send({
      to: email,
      ...handoverInvitationMail({ ...words, link, expiresAt: expiresAt.getTime() }),
    });
  }

  async function recordAccepted(systemIds: string[], owner: PublicUser | { id: string; email: string }) {
    for (const systemId of systemIds) {
      await deps.audit.record(systemId, owner as PublicUser, 'ownership.accepted', owner.email);
      deps.onAccessRevoked?.(systemId);
    }
  }

  return {
    async create(user: PublicUser, request: NewSystemRequest): Promise<CreatedSystem> {
      const installer = user.roles.includes('installer') && !!user.companyId;
      if (!installer && !user.roles.includes('owner'))
        throw forbidden('Only an installer of a company or an owner can set up a system');
      const ownerEmail = request.ownerEmail?.trim().toLowerCase();
      if (installer && !ownerEmail)
        throw invalidInput('ownerEmail', "ownerEmail is required: enter the customer's e-mail address");
      if (!installer && ownerEmail)
        throw invalidInput(
          'ownerEmail',
          'ownerEmail is for installers; an owner sets a system up for themselves',
        );
      if (ownerEmail && ownerEmail === user.email)
        throw invalidInput('ownerEmail', "ownerEmail is your own address; enter the customer's");
      const { ownerEmail: _left, ...fields } = request;
      const systemId = await deps.repository.insertSystem({
        ...fields,
        ownerId: user.id,
        installerCompanyId: installer ? user.companyId : null,
      });
      await deps.audit.record(systemId, user, 'system.created', request.name);
      let handover: CreatedSystem['handover'] = null;
      if (ownerEmail) {
        const expiresAt = new Date(deps.now() + HANDOVER_TTL_MS);
        await deps.repository.createHandover({ systemId, ownerEmail, offeredBy: user.id, expiresAt });
        await deps.audit.record(systemId, user, 'ownership.offered', ownerEmail);
        handover = { ownerEmail, expiresAt: expiresAt.getTime() };
        offer(user, systemId, request.name, ownerEmail).catch((error) =>
          deps.logger.warn('hand-over mail not sent', { systemId, error: String(error) }),
        );
      }
      return { system: await deps.systems.getFor(user, systemId), handover };
    },

    /** Systems set up for me and waiting for me to accept them. */
    listHandovers: (user: PublicUser): Promise<SystemHandover[]> =>
      deps.repository.listOpenFor(user.email, deps.now()),

    async acceptHandover(user: PublicUser, handoverId: string): Promise<{ systemId: string }> {
      if (!isUuid(handoverId)) throw notFound('Hand-over');
      const [systemId] = await deps.repository.accept(user.email, user.id, deps.now(), handoverId);
      if (!systemId) throw notFound('Hand-over');
      await recordAccepted([systemId], user);
      return { systemId };
    },

    /**
     * A new account with this address exists (it came through an invitation sent to the address, so the person
     * controls it): every system waiting for the address becomes theirs, as grants to the address apply.
     */
    async acceptWaiting(email: string, userId: string): Promise<void> {
      const systemIds = await deps.repository.accept(email, userId, deps.now());
      await recordAccepted(systemIds, { id: userId, email });
    },

    /** The owner ends the installer company's rights on their system. */
    async removeInstaller(user: PublicUser, systemId: string): Promise<void> {
      const system = await deps.systems.getFor(user, systemId, 'manage-grants');
      if (system.ownerId !== user.id)
        throw forbidden("Only the system's owner can end the installer's rights");
      const company = await deps.repository.removeInstaller(system.id);
      if (company === null) throw notFound('Installer company');
      await deps.audit.record(system.id, user, 'installer.removed', company);
      deps.onAccessRevoked?.(system.id);
    },

    /** Has the monitor's first reading arrived; if not, what the broker refused it for (this node's counts). */
    async monitorStatus(user: PublicUser, systemId: string, deviceId: string): Promise<MonitorStatus> {
      const system = await deps.systems.getFor(user, systemId, 'manage-devices');
      const device = await deps.devices.findListing(system.id, deviceId);
      if (!device) throw notFound('Device');
      const latestReading = await deps.repository.latestReading(system.id, device.id);
      const refusals = deps.refusals.of(device.id);
      const refused = refusals.credentials + refusals.topic + refusals.payload > 0;
      return {
        deviceId: device.id,
        state: latestReading ? 'arrived' : refused ? 'refused' : 'waiting',
        lastSeenAt: latestReading?.measuredAt ?? device.lastSeenAt,
        latestReading,
        refusals,
      };
    },
  };
}

export type OnboardingService = ReturnType<typeof createOnboardingService>;

import { createHash, randomBytes } from 'node:crypto';
import {
  formatShareCode,
  normalizeShareCode,
  SHARE_CODE_TTL_MS,
  shareCodeFromBytes,
  type AccessRequestApproval,
  type IncomingAccessRequest,
  type NewAccessRequest,
  type OutgoingAccessRequest,
  type PublicUser,
  type ShareCode,
} from '@cellwarden/shared';
import { MAX_GRANT_MS, type GrantsService } from '../access/grants-service';
import type { AccountsRepository } from '../accounts/accounts-repository';
import type { AuditService } from '../audit/audit-service';
import { isUuid } from '../database/sql-values';
import { AppError, forbidden, invalidInput, notFound } from '../errors/app-error';
import type { Logger } from '../logger';
import type { Mailer } from '../mail/mailer';
import { accessRequestMail } from '../onboarding/onboarding-mail';
import type { SystemsService } from '../systems/systems-service';
import type { AccessRequestsRepository, PendingRequest } from './access-requests-repository';
import type { ShareCodeLimits } from './share-code-limits';

/** How long a request waits for the owner before it lapses. */
export const ACCESS_REQUEST_TTL_MS = 3 * 24 * 3600 * 1000;
/** Requests one person may make per hour (each may e-mail an owner). */
export const ACCESS_REQUESTS_PER_HOUR = 20;

// A share code has 40 bits and lives 15 minutes, so a plain SHA-256 is enough: a leaked table is stale
// before the codes in it could be searched for.
const hashCode = (code: string) => createHash('sha256').update(code).digest('hex');

/**
 * Support people ask owners for access; owners answer. Approval makes an ordinary grant, so expiry and
 * revocation work as for any other. What the requester is told never depends on whether the address or the
 * system exists: a request that matched nothing is stored and shown to them exactly like one that did.
 */
export function createAccessRequestsService(deps: {
  repository: AccessRequestsRepository;
  accounts: AccountsRepository;
  systems: SystemsService;
  grants: GrantsService;
  audit: AuditService;
  limits: ShareCodeLimits;
  mailer: Mailer;
  publicUrl: () => string;
  now: () => number;
  logger: Logger;
}) {
  async function systemFromCode(user: PublicUser, typed: string): Promise<string> {
    const code = normalizeShareCode(typed);
    if (!code) throw invalidInput('shareCode', 'shareCode must be 8 letters and digits, like K7QM-2XHD');
    if (!(await deps.limits.mayTry(user.id)))
      throw new AppError(
        'share_code_attempts',
        429,
        'Too many wrong codes; wait 15 minutes, or ask with the owner’s e-mail and the system’s name',
        'shareCode',
      );
    const systemId = await deps.repository.claimShareCode(hashCode(code), user.id, deps.now());
    if (systemId) return systemId;
    await deps.limits.wrong(user.id);
    throw new AppError(
      'share_code_invalid',
      422,
      'This code does not work: it may be mistyped, already used or older than 15 minutes. Ask the owner for a new one',
      'shareCode',
    );
  }

  async function notifyOwner(requester: PublicUser, systemId: string, note: string, expiresAt: Date) {
    const owner = await deps.repository.ownerOf(systemId);
    if (!owner) return;
    const company = requester.companyId ? await deps.accounts.findCompany(requester.companyId) : undefined;
    await deps.mailer.send({
      to: owner.email,
      ...accessRequestMail({
        systemName: owner.systemName,
        requesterName: requester.displayName,
        requesterEmail: requester.email,
        companyName: company?.name ?? null,
        note,
        link: `${deps.publicUrl()}/requests`,
        expiresAt: expiresAt.getTime(),
      }),
    });
  }

  async function pendingOf(owner: PublicUser, requestId: string): Promise<PendingRequest> {
    const request = isUuid(requestId) ? await deps.repository.findPending(requestId, deps.now()) : undefined;
    if (!request) throw notFound('Request');
    // Only someone who may grant access answers; anyone else learns nothing about the request.
    await deps.systems.getFor(owner, request.systemId, 'manage-grants').catch(() => {
      throw notFound('Request');
    });
    return request;
  }

  return {
    /** A new share code for one system (the owner reads it out); earlier unused codes stop working. */
    async createShareCode(user: PublicUser, systemId: string): Promise<ShareCode> {
      const system = await deps.systems.getFor(user, systemId, 'manage-grants');
      const code = shareCodeFromBytes(randomBytes(8));
      const expiresAt = new Date(deps.now() + SHARE_CODE_TTL_MS);
      await deps.repository.createShareCode({
        systemId: system.id,
        codeHash: hashCode(code),
        createdBy: user.id,
        expiresAt,
      });
      await deps.audit.record(system.id, user, 'share-code.created', `until ${expiresAt.toISOString()}`);
      return { code: formatShareCode(code), expiresAt: expiresAt.getTime() };
    },

    async request(user: PublicUser, body: NewAccessRequest): Promise<OutgoingAccessRequest> {
      if (!user.roles.includes('support') || !user.companyId)
        throw forbidden('Only support staff of a company ask owners for access');
      const now = deps.now();
      if ((await deps.repository.countSince(user.id, now - 3600_000)) >= ACCESS_REQUESTS_PER_HOUR)
        throw new AppError('too_many_requests', 429, 'Too many requests this hour; try again later');
      const note = body.note ?? '';
      const byCode = 'shareCode' in body;
      const systemId = byCode
        ? await systemFromCode(user, body.shareCode)
        : await deps.repository.findByOwnerAndName(body.ownerEmail, body.systemName);
      const expiresAt = new Date(now + ACCESS_REQUEST_TTL_MS);
      const alreadyWaiting = !!systemId && (await deps.repository.hasPending(user.id, systemId, now));
      const id = await deps.repository.create({
        requesterId: user.id,
        requesterCompanyId: user.companyId,
        via: byCode ? 'share-code' : 'owner-and-name',
        ownerEmail: byCode ? null : body.ownerEmail,
        systemName: byCode ? null : body.systemName,
        systemId: systemId ?? null,
        note,
        expiresAt,
      });
      if (systemId) {
        await deps.audit.record(
          systemId,
          user,
          'access.requested',
          byCode ? 'by share code' : 'by e-mail and name',
        );
        // Mailed after answering, so the answer takes as long whether or not anything matched.
        if (!alreadyWaiting)
          notifyOwner(user, systemId, note, expiresAt).catch((error) =>
            deps.logger.warn('access request mail not sent', { error: String(error) }),
          );
      }
      return (await deps.repository.listOutgoing(user.id, now, id))[0];
    },

    listOutgoing: (user: PublicUser) => deps.repository.listOutgoing(user.id, deps.now()),

    /** Pending requests on the systems I own (all, or one system's). */
    async listIncoming(user: PublicUser, systemId?: string): Promise<IncomingAccessRequest[]> {
      if (systemId) await deps.systems.getFor(user, systemId, 'manage-grants');
      return deps.repository.listIncoming(user.id, deps.now(), systemId ?? null);
    },

    async approve(
      owner: PublicUser,
      requestId: string,
      approval: { access: AccessRequestApproval['access']; expiresAt: Date },
    ) {
      const now = deps.now();
      if (approval.expiresAt.getTime() <= now)
        throw invalidInput('expiresAt', 'expiresAt must be in the future');
      if (approval.expiresAt.getTime() > now + MAX_GRANT_MS)
        throw invalidInput('expiresAt', 'expiresAt must be within a year');
      const request = await pendingOf(owner, requestId);
      const answered = await deps.repository.decide(request, 'approved', owner.id);
      if (answered.length === 0) throw notFound('Request');
      const grant = await deps.grants.create(owner, request.systemId, {
        granteeEmail: request.requesterEmail,
        access: approval.access,
        expiresAt: approval.expiresAt,
      });
      await deps.repository.attachGrant(answered, grant.id);
      await deps.audit.record(
        request.systemId,
        owner,
        'access.approved',
        `${approval.access} for ${request.requesterEmail} until ${approval.expiresAt.toISOString()}`,
      );
      return grant;
    },

    async decline(owner: PublicUser, requestId: string): Promise<void> {
      const request = await pendingOf(owner, requestId);
      if ((await deps.repository.decide(request, 'declined', owner.id)).length === 0)
        throw notFound('Request');
      await deps.audit.record(request.systemId, owner, 'access.declined', request.requesterEmail);
    },
  };
}

export type AccessRequestsService = ReturnType<typeof createAccessRequestsService>;

import { Op, QueryTypes, col, fn, literal, where, type Sequelize } from 'sequelize';
import type { IncomingAccessRequest, OutgoingAccessRequest } from '@cellwarden/shared';
import { initModels } from '../database/models';

/** A pending request as the service needs it to decide. */
export interface PendingRequest {
  id: string;
  systemId: string;
  requesterId: string;
  requesterEmail: string;
}

const MS = (column: string) => `(extract(epoch FROM ${column}) * 1000)::float8`;

// An owner's pending requests, the newest per requester and system. SQL for DISTINCT ON (one row per pair,
// chosen by created_at), which a model's finder does not say.
const LIST_INCOMING_SQL = `SELECT * FROM (
    SELECT DISTINCT ON (r.system_id, r.requester_id) r.id, r.system_id AS "systemId", s.name AS "systemName",
      json_build_object('email', u.email, 'displayName', u.display_name, 'companyName', c.name) AS requester,
      r.via, r.note, ${MS('r.created_at')} AS "createdAt", ${MS('r.expires_at')} AS "expiresAt"
    FROM access_requests r JOIN systems s ON s.id = r.system_id JOIN users u ON u.id = r.requester_id
    LEFT JOIN companies c ON c.id = r.requester_company_id
    WHERE s.owner_id = :ownerId AND r.decision IS NULL AND r.expires_at > to_timestamp(:now / 1000.0)
      AND (:systemId::uuid IS NULL OR r.system_id = :systemId::uuid)
    ORDER BY r.system_id, r.requester_id, r.created_at DESC) newest
  ORDER BY "createdAt" DESC`;

/** Data access for share codes and access requests. */
export function createAccessRequestsRepository(sequelize: Sequelize) {
  const { ShareCode, AccessRequest, System, User } = initModels(sequelize);
  return {
    /** Stores a new code for a system and ends every earlier unused one: one live code per system. */
    async createShareCode(code: { systemId: string; codeHash: string; createdBy: string; expiresAt: Date }) {
      await sequelize.transaction(async (transaction) => {
        await ShareCode.update(
          { expiresAt: literal('least(expires_at, now())') },
          { where: { systemId: code.systemId, usedAt: null }, transaction },
        );
        await ShareCode.create(code, { transaction, returning: false });
      });
    },

    /** Uses a code once: the system it opens, or undefined when it is unknown, used or expired. */
    async claimShareCode(codeHash: string, userId: string, now: number): Promise<string | undefined> {
      const [, rows] = await ShareCode.scope({ method: ['active', now] }).update(
        { usedAt: fn('now'), usedBy: userId },
        { where: { codeHash }, returning: true },
      );
      return rows[0]?.systemId;
    },

    /** The system of this owner by that name (trimmed, any case), or undefined. */
    async findByOwnerAndName(ownerEmail: string, systemName: string): Promise<string | undefined> {
      const row = await System.findOne({
        where: where(fn('lower', col('System.name')), fn('lower', systemName)),
        attributes: ['id'],
        include: [{ model: User, as: 'owner', attributes: [], where: { email: ownerEmail }, required: true }],
        order: [['createdAt', 'ASC']],
      });
      return row?.id;
    },

    async ownerOf(systemId: string): Promise<{ email: string; systemName: string } | undefined> {
      const row = await System.findByPk(systemId, {
        attributes: ['name'],
        include: [{ model: User, as: 'owner', attributes: ['email'], required: true }],
      });
      return row?.owner ? { email: row.owner.email, systemName: row.name } : undefined;
    },

    countSince: (requesterId: string, since: number) =>
      AccessRequest.count({ where: { requesterId, createdAt: { [Op.gt]: new Date(since) } } }),

    /** Whether this person already has a request waiting on this system (the owner is mailed once). */
    async hasPending(requesterId: string, systemId: string, now: number): Promise<boolean> {
      return (
        (await AccessRequest.scope({ method: ['active', now] }).count({ where: { requesterId, systemId } })) >
        0
      );
    },

    async create(request: {
      requesterId: string;
      requesterCompanyId: string | null;
      via: OutgoingAccessRequest['via'];
      ownerEmail: string | null;
      systemName: string | null;
      systemId: string | null;
      note: string;
      expiresAt: Date;
    }): Promise<string> {
      const row = await AccessRequest.create(request, { returning: ['id'] });
      return row.id;
    },

    /** What the requester sees: only what they typed, and the state. */
    async listOutgoing(requesterId: string, now: number, id?: string): Promise<OutgoingAccessRequest[]> {
      const rows = await AccessRequest.findAll({
        where: id === undefined ? { requesterId } : { requesterId, id },
        attributes: ['id', 'via', 'ownerEmail', 'systemName', 'createdAt', 'expiresAt', 'decision'],
        order: [['createdAt', 'DESC']],
        limit: 100,
        raw: true,
      });
      return rows.map((row) => ({
        id: row.id,
        via: row.via,
        ownerEmail: row.ownerEmail,
        systemName: row.systemName,
        createdAt: row.createdAt.getTime(),
        expiresAt: row.expiresAt.getTime(),
        state: row.decision ?? (row.expiresAt.getTime() <= now ? 'expired' : 'pending'),
      }));
    },

    /** Pending requests on systems this person owns (one per requester and system, the newest). */
    listIncoming: (ownerId: string, now: number, systemId: string | null) =>
      sequelize.query<IncomingAccessRequest>(LIST_INCOMING_SQL, {
        replacements: { ownerId, now, systemId },
        type: QueryTypes.SELECT,
      }),

    async findPending(id: string, now: number): Promise<PendingRequest | undefined> {
      const row = await AccessRequest.scope({ method: ['active', now] }).findOne({
        where: { id, systemId: { [Op.ne]: null } },
        attributes: ['id', 'systemId', 'requesterId'],
        include: [{ model: User, as: 'requester', attributes: ['email'], required: true }],
      });
      return row
        ? {
            id: row.id,
            systemId: row.systemId!,
            requesterId: row.requesterId,
            requesterEmail: row.requester!.email,
          }
        : undefined;
    },

    /**
     * Records the owner's answer on this request and the same person's other pending ones for the system;
     * the ids answered now (none when someone answered first, so one approval makes one grant).
     */
    async decide(request: PendingRequest, decision: 'approved' | 'declined', decidedBy: string) {
      const [, rows] = await AccessRequest.update(
        { decision, decidedAt: fn('now'), decidedBy },
        {
          where: { systemId: request.systemId, requesterId: request.requesterId, decision: null },
          returning: ['id'],
        },
      );
      return rows.map((row) => row.id);
    },

    async attachGrant(ids: string[], grantId: string): Promise<void> {
      await AccessRequest.update({ grantId }, { where: { id: ids } });
    },
  };
}

export type AccessRequestsRepository = ReturnType<typeof createAccessRequestsRepository>;

import { QueryTypes, type Sequelize } from 'sequelize';
import type { IncomingAccessRequest, OutgoingAccessRequest } from '@cellwarden/shared';

/** A pending request as the service needs it to decide. */
export interface PendingRequest {
  id: string;
  systemId: string;
  requesterId: string;
  requesterEmail: string;
}

const STATE = `CASE WHEN r.decision IS NOT NULL THEN r.decision
  WHEN r.expires_at <= to_timestamp(:now / 1000.0) THEN 'expired' ELSE 'pending' END`;
const MS = (column: string) => `(extract(epoch FROM ${column}) * 1000)::float8`;

/** Data access for share codes and access requests. */
export function createAccessRequestsRepository(sequelize: Sequelize) {
  const select = <T extends object>(sql: string, replacements: Record<string, unknown>) =>
    sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });
  return {
    /** Stores a new code for a system and ends every earlier unused one: one live code per system. */
    async createShareCode(code: { systemId: string; codeHash: string; createdBy: string; expiresAt: Date }) {
      await sequelize.transaction(async (transaction) => {
        await sequelize.query(
          `UPDATE access_share_codes SET expires_at = least(expires_at, now())
           WHERE system_id = :systemId AND used_at IS NULL`,
          { replacements: code, transaction },
        );
        await sequelize.query(
          `INSERT INTO access_share_codes (system_id, code_hash, created_by, expires_at)
           VALUES (:systemId, :codeHash, :createdBy, :expiresAt)`,
          { replacements: code, transaction },
        );
      });
    },

    /** Uses a code once: the system it opens, or undefined when it is unknown, used or expired. */
    async claimShareCode(codeHash: string, userId: string, now: number): Promise<string | undefined> {
      const [row] = await select<{ systemId: string }>(
        `UPDATE access_share_codes SET used_at = now(), used_by = :userId
         WHERE code_hash = :codeHash AND used_at IS NULL AND expires_at > to_timestamp(:now / 1000.0)
         RETURNING system_id AS "systemId"`,
        { codeHash, userId, now },
      );
      return row?.systemId;
    },

    /** The system of this owner by that name (trimmed, any case), or undefined. */
    async findByOwnerAndName(ownerEmail: string, systemName: string): Promise<string | undefined> {
      const [row] = await select<{ id: string }>(
        `SELECT s.id FROM systems s JOIN users u ON u.id = s.owner_id
         WHERE u.email = :ownerEmail AND lower(s.name) = lower(:systemName) ORDER BY s.created_at LIMIT 1`,
        { ownerEmail, systemName },
      );
      return row?.id;
    },

    async ownerOf(systemId: string): Promise<{ email: string; systemName: string } | undefined> {
      const [row] = await select<{ email: string; systemName: string }>(
        `SELECT u.email, s.name AS "systemName" FROM systems s JOIN users u ON u.id = s.owner_id WHERE s.id = :systemId`,
        { systemId },
      );
      return row;
    },

    countSince: async (requesterId: string, since: number) =>
      (
        await select<{ n: number }>(
          `SELECT count(*)::int AS n FROM access_requests
           WHERE requester_id = :requesterId AND created_at > to_timestamp(:since / 1000.0)`,
          { requesterId, since },
        )
      )[0].n,

    /** Whether this person already has a request waiting on this system (the owner is mailed once). */
    async hasPending(requesterId: string, systemId: string, now: number): Promise<boolean> {
      const rows = await select(
        `SELECT 1 FROM access_requests WHERE requester_id = :requesterId AND system_id = :systemId
           AND decision IS NULL AND expires_at > to_timestamp(:now / 1000.0)`,
        { requesterId, systemId, now },
      );
      return rows.length > 0;
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
      const [row] = await select<{ id: string }>(
        `INSERT INTO access_requests (requester_id, requester_company_id, via, owner_email, system_name, system_id, note, expires_at)
         VALUES (:requesterId, :requesterCompanyId, :via, :ownerEmail, :systemName, :systemId, :note, :expiresAt)
         RETURNING id`,
        request,
      );
      return row.id;
    },

    /** What the requester sees: only what they typed, and the state. */
    listOutgoing: (requesterId: string, now: number, id?: string) =>
      select<OutgoingAccessRequest>(
        `SELECT r.id, r.via, r.owner_email AS "ownerEmail", r.system_name AS "systemName",
           ${MS('r.created_at')} AS "createdAt", ${MS('r.expires_at')} AS "expiresAt", ${STATE} AS state
         FROM access_requests r WHERE r.requester_id = :requesterId AND (:id::uuid IS NULL OR r.id = :id::uuid)
         ORDER BY r.created_at DESC LIMIT 100`,
        { requesterId, now, id: id ?? null },
      ),

    /** Pending requests on systems this person owns (one per requester and system, the newest). */
    listIncoming: (ownerId: string, now: number, systemId: string | null) =>
      select<IncomingAccessRequest>(
        `SELECT * FROM (
           SELECT DISTINCT ON (r.system_id, r.requester_id) r.id, r.system_id AS "systemId", s.name AS "systemName",
             json_build_object('email', u.email, 'displayName', u.display_name, 'companyName', c.name) AS requester,
             r.via, r.note, ${MS('r.created_at')} AS "createdAt", ${MS('r.expires_at')} AS "expiresAt"
           FROM access_requests r JOIN systems s ON s.id = r.system_id JOIN users u ON u.id = r.requester_id
           LEFT JOIN companies c ON c.id = r.requester_company_id
           WHERE s.owner_id = :ownerId AND r.decision IS NULL AND r.expires_at > to_timestamp(:now / 1000.0)
             AND (:systemId::uuid IS NULL OR r.system_id = :systemId::uuid)
           ORDER BY r.system_id, r.requester_id, r.created_at DESC) newest
         ORDER BY "createdAt" DESC`,
        { ownerId, now, systemId },
      ),

    async findPending(id: string, now: number): Promise<PendingRequest | undefined> {
      const [row] = await select<PendingRequest>(
        `SELECT r.id, r.system_id AS "systemId", r.requester_id AS "requesterId", u.email AS "requesterEmail"
         FROM access_requests r JOIN users u ON u.id = r.requester_id
         WHERE r.id = :id AND r.system_id IS NOT NULL AND r.decision IS NULL
           AND r.expires_at > to_timestamp(:now / 1000.0)`,
        { id, now },
      );
      return row;
    },

    /**
     * Records the owner's answer on this request and the same person's other pending ones for the system;
     * the ids answered now (none when someone answered first, so one approval makes one grant).
     */
    async decide(request: PendingRequest, decision: 'approved' | 'declined', decidedBy: string) {
      const rows = await select<{ id: string }>(
        `UPDATE access_requests SET decision = :decision, decided_at = now(), decided_by = :decidedBy
         WHERE system_id = :systemId AND requester_id = :requesterId AND decision IS NULL RETURNING id`,
        { systemId: request.systemId, requesterId: request.requesterId, decision, decidedBy },
      );
      return rows.map((row) => row.id);
    },

    async attachGrant(ids: string[], grantId: string): Promise<void> {
      await sequelize.query(`UPDATE access_requests SET grant_id = :grantId WHERE id IN (:ids)`, {
        replacements: { ids, grantId },
      });
    },
  };
}

export type AccessRequestsRepository = ReturnType<typeof createAccessRequestsRepository>;

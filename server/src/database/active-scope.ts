// The `active` scope of the rows that end in one of two ways: closed by someone (used, decided, accepted,
// revoked: a nullable time or decision column) or expired. Written once here for every model that has one.
import { Op, fn } from 'sequelize';

/**
 * Active at the caller's instant (`now`, epoch ms), for rows the access rule judges: every row of one request
 * is decided at the same `now`, which tests move. Use as `scopes: { active: activeAt('revokedAt') }`.
 */
export function activeAt(closedColumn: string) {
  return (now: number) => ({ where: { [closedColumn]: null, expiresAt: { [Op.gt]: new Date(now) } } });
}

/** Active on the database's clock (`now()` in the query), for tokens and links the database alone judges. */
export function activeOnDatabaseClock(closedColumn: string) {
  return { where: { [closedColumn]: null, expiresAt: { [Op.gt]: fn('now') } } };
}

/**
 * A system may carry more than one battery monitor (a shunt and the BMS's own, say). Its headline figures, its
 * analytics and its raw history follow one of them, the lead monitor: the earliest registered one still in
 * service. The others are shown beside it, labelled, never interleaved with it. (Minute and hour rollups are
 * means over every monitor of the bank in the bucket, which is what a bank-wide summary should be.)
 */
export const LEAD_MONITOR_SQL = (systemIdExpression: string) =>
  `(SELECT d.id FROM devices d WHERE d.system_id = ${systemIdExpression} AND d.revoked_at IS NULL
    ORDER BY d.created_at, d.id LIMIT 1)`;

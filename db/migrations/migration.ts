import type { Sequelize } from 'sequelize';

/** One schema step; multi-statement steps run inside a transaction. */
export interface Migration {
  name: string;
  up(sequelize: Sequelize): Promise<void>;
  down(sequelize: Sequelize): Promise<void>;
}

/** Runs several statements as one transaction, so a failed step leaves no half-made schema. */
export async function inTransaction(sequelize: Sequelize, statements: string[]): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    for (const sql of statements) await sequelize.query(sql, { transaction });
  });
}

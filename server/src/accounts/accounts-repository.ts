import { QueryTypes, type Sequelize } from 'sequelize';

/** A person who signs in, as stored. */
export interface UserRecord {
  id: string;
  email: string;
  displayName: string;
  passwordHash: string;
  roles: string[];
  companyId: string | null;
}

const SELECT_USER = `SELECT id, email, display_name AS "displayName", password_hash AS "passwordHash",
  roles, company_id AS "companyId" FROM users`;

/** Data access for users: plain objects in, plain objects out. */
export function createAccountsRepository(sequelize: Sequelize) {
  return {
    async findByEmail(email: string): Promise<UserRecord | undefined> {
      const rows = await sequelize.query<UserRecord>(`${SELECT_USER} WHERE email = :email`, {
        replacements: { email },
        type: QueryTypes.SELECT,
      });
      return rows[0];
    },
    async findById(id: string): Promise<UserRecord | undefined> {
      const rows = await sequelize.query<UserRecord>(`${SELECT_USER} WHERE id = :id`, {
        replacements: { id },
        type: QueryTypes.SELECT,
      });
      return rows[0];
    },
  };
}

export type AccountsRepository = ReturnType<typeof createAccountsRepository>;

import { QueryTypes, type Sequelize } from 'sequelize';
import type { CompanyListing, CompanyMember, Role } from '@cellwarden/shared';

/** A person who signs in, as stored. */
export interface UserRecord {
  id: string;
  email: string;
  displayName: string;
  passwordHash: string;
  roles: Role[];
  companyId: string | null;
}

const SELECT_USER = `SELECT id, email, display_name AS "displayName", password_hash AS "passwordHash",
  roles, company_id AS "companyId" FROM users`;

/** Data access for users and companies: plain objects in, plain objects out. */
export function createAccountsRepository(sequelize: Sequelize) {
  const one = async <T extends object>(sql: string, replacements: Record<string, unknown>) =>
    (await sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT }))[0];
  return {
    findByEmail: (email: string) => one<UserRecord>(`${SELECT_USER} WHERE email = :email`, { email }),
    findById: (id: string) => one<UserRecord>(`${SELECT_USER} WHERE id = :id`, { id }),

    async createUser(user: Omit<UserRecord, 'id'>): Promise<UserRecord> {
      const row = await one<{ id: string }>(
        `INSERT INTO users (email, display_name, password_hash, roles, company_id)
         VALUES (:email, :displayName, :passwordHash, ARRAY[:roles]::text[], :companyId) RETURNING id`,
        { ...user },
      );
      return { ...user, id: row!.id };
    },

    async setPassword(userId: string, passwordHash: string): Promise<void> {
      await sequelize.query(
        `UPDATE users SET password_hash = :passwordHash, updated_at = now() WHERE id = :userId`,
        {
          replacements: { userId, passwordHash },
        },
      );
    },

    listCompanies: () =>
      sequelize.query<CompanyListing>(`SELECT id, name FROM companies ORDER BY name`, {
        type: QueryTypes.SELECT,
      }),

    findCompany: (id: string) => one<CompanyListing>(`SELECT id, name FROM companies WHERE id = :id`, { id }),

    listMembers: (companyId: string) =>
      sequelize.query<CompanyMember>(
        `SELECT id, email, display_name AS "displayName", roles FROM users WHERE company_id = :companyId ORDER BY display_name`,
        { replacements: { companyId }, type: QueryTypes.SELECT },
      ),
  };
}

export type AccountsRepository = ReturnType<typeof createAccountsRepository>;

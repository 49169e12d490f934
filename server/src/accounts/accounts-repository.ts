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

    /** A member of this company, or undefined (someone else's member is not revealed). */
    findMember: (companyId: string, userId: string) =>
      one<UserRecord>(`${SELECT_USER} WHERE id = :userId AND company_id = :companyId`, { companyId, userId }),

    async setRoles(userId: string, roles: Role[]): Promise<void> {
      await sequelize.query(
        `UPDATE users SET roles = :roles::text[], updated_at = now() WHERE id = :userId`,
        // An array literal of the fixed role names (checked by the table's CHECK constraint too).
        { replacements: { userId, roles: `{${roles.join(',')}}` } },
      );
    },

    /** Takes a person out of their company; `roles` are what they keep (an owner stays an owner). */
    async leaveCompany(userId: string, roles: Role[]): Promise<void> {
      await sequelize.query(
        `UPDATE users SET company_id = NULL, roles = :roles::text[], updated_at = now() WHERE id = :userId`,
        { replacements: { userId, roles: `{${roles.join(',')}}` } },
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

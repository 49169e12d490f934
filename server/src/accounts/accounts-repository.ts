import type { Sequelize } from 'sequelize';
import type { CompanyListing, CompanyMember, Role } from '@cellwarden/shared';
import { initModels } from '../database/models';

/** A person who signs in, as stored. */
export interface UserRecord {
  id: string;
  email: string;
  displayName: string;
  passwordHash: string;
  roles: Role[];
  companyId: string | null;
}

/** The columns of a UserRecord; `raw` finds return them as a plain object under these names. */
export const USER_RECORD_ATTRIBUTES = ['id', 'email', 'displayName', 'passwordHash', 'roles', 'companyId'];

/** Data access for users and companies: plain objects in, plain objects out. */
export function createAccountsRepository(sequelize: Sequelize) {
  const { User, Company } = initModels(sequelize);
  const findUser = async (where: Record<string, string>) =>
    (await User.findOne({ where, attributes: USER_RECORD_ATTRIBUTES, raw: true })) ?? undefined;
  return {
    findByEmail: (email: string): Promise<UserRecord | undefined> => findUser({ email }),
    findById: (id: string): Promise<UserRecord | undefined> => findUser({ id }),

    async createUser(user: Omit<UserRecord, 'id'>): Promise<UserRecord> {
      const created = await User.create({ ...user });
      return { ...user, id: created.id };
    },

    async setPassword(userId: string, passwordHash: string): Promise<void> {
      await User.update({ passwordHash }, { where: { id: userId } });
    },

    /** A member of this company, or undefined (someone else's member is not revealed). */
    findMember: (companyId: string, userId: string): Promise<UserRecord | undefined> =>
      findUser({ id: userId, companyId }),

    // Roles are the fixed role names (checked by the table's CHECK constraint too).
    async setRoles(userId: string, roles: Role[]): Promise<void> {
      await User.update({ roles }, { where: { id: userId } });
    },

    /** Takes a person out of their company; `roles` are what they keep (an owner stays an owner). */
    async leaveCompany(userId: string, roles: Role[]): Promise<void> {
      await User.update({ companyId: null, roles }, { where: { id: userId } });
    },

    listCompanies: (): Promise<CompanyListing[]> =>
      Company.findAll({ attributes: ['id', 'name'], order: [['name', 'ASC']], raw: true }),

    findCompany: async (id: string): Promise<CompanyListing | undefined> =>
      (await Company.findOne({ where: { id }, attributes: ['id', 'name'], raw: true })) ?? undefined,

    listMembers: (companyId: string): Promise<CompanyMember[]> =>
      User.findAll({
        where: { companyId },
        attributes: ['id', 'email', 'displayName', 'roles'],
        order: [['displayName', 'ASC']],
        raw: true,
      }) as Promise<CompanyMember[]>,
  };
}

export type AccountsRepository = ReturnType<typeof createAccountsRepository>;

import type { PublicUser } from '../accounts/accounts-service';
import type { StoredSystem, Visibility } from './systems-repository';

// The object-level access rule, in one place: every route and every stream subscription asks it.
// Foundation rule: an owner sees their systems; installers and admins see their company's systems.
// Support staff see a system only through an owner's grant (not yet built), so nothing for now.

/** Which systems a user's list contains. */
export function visibilityFor(user: PublicUser): Visibility {
  return {
    userId: user.id,
    companyId: user.companyId,
    seesCompanySystems: user.roles.includes('installer') || user.roles.includes('admin'),
  };
}

/** Whether a user may view one system's data. */
export function mayViewSystem(
  user: PublicUser,
  system: Pick<StoredSystem, 'ownerId' | 'installerCompanyId'>,
): boolean {
  if (system.ownerId === user.id) return true;
  const visibility = visibilityFor(user);
  return visibility.seesCompanySystems && !!user.companyId && system.installerCompanyId === user.companyId;
}

import type { PublicUser } from '../accounts/accounts-service';
import { notFound } from '../errors/app-error';
import { mayViewSystem, visibilityFor } from './system-access';
import type { StoredSystem, SystemsRepository } from './systems-repository';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Listing and opening systems, with the access rule applied. */
export function createSystemsService(repository: SystemsRepository) {
  return {
    listFor: (user: PublicUser) => repository.listVisible(visibilityFor(user)),

    /** A system the user may view; 404 both when it does not exist and when they may not see it. */
    async getFor(user: PublicUser, systemId: string): Promise<StoredSystem> {
      const system = UUID.test(systemId) ? await repository.findById(systemId) : undefined;
      if (!system || !mayViewSystem(user, system)) throw notFound('System');
      return system;
    },
  };
}

export type SystemsService = ReturnType<typeof createSystemsService>;

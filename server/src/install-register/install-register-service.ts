import {
  energyBudget,
  judgeCircuit,
  registerBudgetInput,
  registeredSourceRatingA,
  type CircuitWiring,
  type ComponentRatings,
  type InstallRegister,
  type PublicUser,
  type RegisterCircuit,
  type RegisterComponent,
} from '@cellwarden/shared';
import type { AuditService } from '../audit/audit-service';
import { isUuid } from '../database/sql-values';
import { AppError, invalidInput, notFound } from '../errors/app-error';
import type { StoredSystem } from '../systems/systems-repository';
import type { SystemsService } from '../systems/systems-service';
import type { InstallRegisterRepository, StoredCircuit } from './install-register-repository';

/** A registered circuit with its verdict, judged against the system and the component it feeds. */
export function withVerdict(
  circuit: StoredCircuit,
  components: readonly RegisterComponent[],
  system: Pick<StoredSystem, 'kind' | 'nominalVoltage'>,
): RegisterCircuit {
  const component = components.find((c) => c.id === circuit.componentId);
  return { ...circuit, verdict: judgeCircuit(circuit, component, system) };
}

/** The install register: components and circuits of a system, read with view, changed with configure. */
export function createInstallRegisterService(deps: {
  repository: InstallRegisterRepository;
  systems: SystemsService;
  audit: AuditService;
}) {
  const { repository } = deps;

  async function checkCircuit(systemId: string, wiring: CircuitWiring) {
    const components = await repository.components(systemId);
    const fed = components.find((c) => c.id === wiring.componentId);
    if (!fed) throw invalidInput('componentId', 'componentId must name a component of this system');
    if (
      wiring.monitoring === 'source' &&
      !(fed.ratings.kind === 'charge-source' && fed.ratings.monitorSourceId)
    )
      throw invalidInput(
        'monitoring',
        'monitoring "source" needs a charge source whose current the monitor reports (its monitorSourceId)',
      );
    return components;
  }

  return {
    async get(user: PublicUser, systemId: string): Promise<InstallRegister> {
      const system = await deps.systems.getFor(user, systemId, 'view');
      const components = await repository.components(system.id);
      const circuits = (await repository.circuits(system.id)).map((c) => withVerdict(c, components, system));
      const budgetInput = registerBudgetInput(components, system.nominalVoltage);
      return {
        systemId: system.id,
        components,
        circuits,
        budget: budgetInput ? energyBudget(budgetInput) : null,
      };
    },

    async addComponent(user: PublicUser, systemId: string, name: string, ratings: ComponentRatings) {
      const system = await deps.systems.getFor(user, systemId, 'configure');
      const component = await repository.addComponent(system.id, name, ratings);
      await deps.audit.record(system.id, user, 'system.changed', `install register: ${name} added`);
      return component;
    },

    async updateComponent(
      user: PublicUser,
      systemId: string,
      componentId: string,
      name: string,
      ratings: ComponentRatings,
    ) {
      const system = await deps.systems.getFor(user, systemId, 'configure');
      const component = isUuid(componentId)
        ? await repository.updateComponent(system.id, componentId, name, ratings)
        : undefined;
      if (!component) throw notFound('Component');
      await deps.audit.record(system.id, user, 'system.changed', `install register: ${name} changed`);
      return component;
    },

    async removeComponent(user: PublicUser, systemId: string, componentId: string) {
      const system = await deps.systems.getFor(user, systemId, 'configure');
      const outcome = isUuid(componentId)
        ? await repository.removeComponent(system.id, componentId)
        : 'missing';
      if (outcome === 'missing') throw notFound('Component');
      if (outcome === 'in-use')
        throw new AppError(
          'component_in_use',
          409,
          'A circuit feeds this component; remove or change that circuit first',
        );
    },

    async addCircuit(user: PublicUser, systemId: string, wiring: CircuitWiring) {
      const system = await deps.systems.getFor(user, systemId, 'configure');
      const components = await checkCircuit(system.id, wiring);
      const circuit = withVerdict(await repository.addCircuit(system.id, wiring), components, system);
      await deps.audit.record(
        system.id,
        user,
        'system.changed',
        `install register: circuit ${wiring.name} added`,
      );
      return circuit;
    },

    async updateCircuit(user: PublicUser, systemId: string, circuitId: string, wiring: CircuitWiring) {
      const system = await deps.systems.getFor(user, systemId, 'configure');
      if (!isUuid(circuitId)) throw notFound('Circuit');
      const components = await checkCircuit(system.id, wiring);
      const stored = await repository.updateCircuit(system.id, circuitId, wiring);
      if (!stored) throw notFound('Circuit');
      await deps.audit.record(
        system.id,
        user,
        'system.changed',
        `install register: circuit ${wiring.name} changed`,
      );
      return withVerdict(stored, components, system);
    },

    async removeCircuit(user: PublicUser, systemId: string, circuitId: string) {
      const system = await deps.systems.getFor(user, systemId, 'configure');
      if (!(isUuid(circuitId) && (await repository.removeCircuit(system.id, circuitId))))
        throw notFound('Circuit');
    },

    /** The rated current the register gives a charge source the monitor reports (for commissioning checks). */
    async sourceRatingA(systemId: string, sourceId: string): Promise<number | undefined> {
      return registeredSourceRatingA(await repository.components(systemId), sourceId);
    },
  };
}

export type InstallRegisterService = ReturnType<typeof createInstallRegisterService>;

import type { Sequelize } from 'sequelize';
import type { AlertsRepository } from '../alerts/alerts-repository';
import type { AlertsService } from '../alerts/alerts-service';
import type { AuditService } from '../audit/audit-service';
import type { Logger } from '../logger';
import type { SettingsRepository } from '../settings/settings-repository';
import { createSystemsRepository } from '../systems/systems-repository';
import type { SystemsService } from '../systems/systems-service';
import { createDesignVsMeasuredService } from './design-vs-measured-service';
import { createInstallRegisterRepository } from './install-register-repository';
import { createInstallRegisterRoutes } from './install-register-routes';
import { recordCircuits, recordComponents } from './install-register-record';
import { createInstallRegisterService, withVerdict } from './install-register-service';
import type { RegisterForRecord } from '../installer/commissioning-record-service';
import { createMeasuredCurrentsRepository } from './measured-currents-repository';

/** How often every monitored circuit is compared with its ratings (and the flag brought up to date). */
const SWEEP_MS = 10 * 60_000;

/** The install register's entry point: its service, the design-against-measured comparison and routes. */
export function createInstallRegisterComponent(deps: {
  sequelize: Sequelize;
  systems: SystemsService;
  audit: AuditService;
  settings: SettingsRepository;
  alerts: AlertsService;
  alertsRepository: AlertsRepository;
  logger: Logger;
  now: () => number;
}) {
  const repository = createInstallRegisterRepository(deps.sequelize);
  const register = createInstallRegisterService({ repository, systems: deps.systems, audit: deps.audit });
  const systemsRepository = createSystemsRepository(deps.sequelize);
  const currents = createMeasuredCurrentsRepository(deps.sequelize);
  const measured = createDesignVsMeasuredService({
    ...deps,
    register: repository,
    measured: currents,
    findSystem: (id) => systemsRepository.findById(id),
  });
  const forRecord: RegisterForRecord = {
    async sections(systemId) {
      const system = await systemsRepository.findById(systemId);
      const components = await repository.components(systemId);
      const circuits = await repository.circuits(systemId);
      if (!system || (components.length === 0 && circuits.length === 0)) return undefined;
      const judged = circuits.map((c) => withVerdict(c, components, system));
      return { components: recordComponents(components), circuits: recordCircuits(judged, components) };
    },
    async sourceRatings(systemId) {
      const ratings = new Map<string, number>();
      for (const { ratings: r } of await repository.components(systemId))
        if (r.kind === 'charge-source' && r.monitorSourceId) ratings.set(r.monitorSourceId, r.ratedCurrentA);
      return ratings;
    },
    chart: (systemId, sourceId, from, to) => currents.chart(systemId, sourceId, from, to),
  };
  measured.start(SWEEP_MS);
  return {
    register,
    measured,
    forRecord,
    routes: createInstallRegisterRoutes({ register, measured }),
    close: () => measured.close(),
  };
}

export type InstallRegisterComponent = ReturnType<typeof createInstallRegisterComponent>;

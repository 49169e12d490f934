import type { Sequelize } from 'sequelize';
import type { CircuitWiring, RegisterComponent } from '@cellwarden/shared';
import { initModels } from '../database/models';
import type { InstallCircuit, InstallComponent } from './install-register-models';

/** A stored circuit: its wiring and its id. */
export type StoredCircuit = CircuitWiring & { id: string };

function toComponent(row: InstallComponent): RegisterComponent {
  return { id: row.id, name: row.name, ratings: row.ratings };
}

function toCircuit(row: InstallCircuit): StoredCircuit {
  return {
    id: row.id,
    name: row.name,
    componentId: row.componentId,
    conductor: row.conductorAwg !== null ? { awg: row.conductorAwg } : { mm2: Number(row.conductorMm2) },
    construction: row.construction,
    oneWayLengthM: row.oneWayLengthM,
    insulationRatingC: row.insulationRatingC,
    location: row.location,
    ambientC: row.ambientC,
    bundledConductors: row.bundledConductors,
    protection: {
      device: row.protectionDevice,
      ratingA: row.protectionRatingA,
      type: row.protectionType,
    },
    fuseDistanceM: row.fuseDistanceM,
    sheathed: row.sheathed,
    designCurrentA: row.designCurrentA,
    allowedDropPercent: row.allowedDropPercent,
    monitoring: row.monitoring,
  };
}

function circuitColumns(wiring: CircuitWiring) {
  return {
    name: wiring.name,
    componentId: wiring.componentId,
    conductorAwg: wiring.conductor.awg ?? null,
    conductorMm2: wiring.conductor.mm2 ?? null,
    construction: wiring.construction,
    oneWayLengthM: wiring.oneWayLengthM,
    insulationRatingC: wiring.insulationRatingC,
    location: wiring.location,
    ambientC: wiring.ambientC,
    bundledConductors: wiring.bundledConductors,
    protectionDevice: wiring.protection.device,
    protectionRatingA: wiring.protection.ratingA,
    protectionType: wiring.protection.type,
    fuseDistanceM: wiring.fuseDistanceM,
    sheathed: wiring.sheathed,
    designCurrentA: wiring.designCurrentA,
    allowedDropPercent: wiring.allowedDropPercent,
    monitoring: wiring.monitoring,
  };
}

/** Data access for the install register, through its models; returns plain objects. */
export function createInstallRegisterRepository(sequelize: Sequelize) {
  const { InstallComponent: Component, InstallCircuit: Circuit } = initModels(sequelize);
  return {
    async components(systemId: string): Promise<RegisterComponent[]> {
      const rows = await Component.findAll({ where: { systemId }, order: [['createdAt', 'ASC']] });
      return rows.map(toComponent);
    },
    async circuits(systemId: string): Promise<StoredCircuit[]> {
      const rows = await Circuit.findAll({ where: { systemId }, order: [['createdAt', 'ASC']] });
      return rows.map(toCircuit);
    },
    async addComponent(systemId: string, name: string, ratings: RegisterComponent['ratings']) {
      return toComponent(await Component.create({ systemId, name, kind: ratings.kind, ratings }));
    },
    /** Replaces a component's name and ratings; undefined when the system has no such component. */
    async updateComponent(
      systemId: string,
      id: string,
      name: string,
      ratings: RegisterComponent['ratings'],
    ): Promise<RegisterComponent | undefined> {
      const row = await Component.findOne({ where: { systemId, id } });
      if (!row) return undefined;
      return toComponent(await row.update({ name, kind: ratings.kind, ratings }));
    },
    /** Removes a component no circuit feeds: 'removed', 'missing', or 'in-use'. */
    async removeComponent(systemId: string, id: string): Promise<'removed' | 'missing' | 'in-use'> {
      if ((await Circuit.count({ where: { systemId, componentId: id } })) > 0) return 'in-use';
      return (await Component.destroy({ where: { systemId, id } })) > 0 ? 'removed' : 'missing';
    },
    async hasComponent(systemId: string, id: string): Promise<boolean> {
      return (await Component.count({ where: { systemId, id } })) > 0;
    },
    async addCircuit(systemId: string, wiring: CircuitWiring): Promise<StoredCircuit> {
      return toCircuit(await Circuit.create({ systemId, ...circuitColumns(wiring) }));
    },
    async updateCircuit(
      systemId: string,
      id: string,
      wiring: CircuitWiring,
    ): Promise<StoredCircuit | undefined> {
      const row = await Circuit.findOne({ where: { systemId, id } });
      if (!row) return undefined;
      return toCircuit(await row.update(circuitColumns(wiring)));
    },
    async removeCircuit(systemId: string, id: string): Promise<boolean> {
      return (await Circuit.destroy({ where: { systemId, id } })) > 0;
    },
    /** Systems with a circuit the monitor sees, for the periodic comparison with ratings. */
    async monitoredSystemIds(): Promise<string[]> {
      const rows = await Circuit.findAll({
        attributes: ['systemId'],
        where: { monitoring: ['battery-feed', 'source'] },
        group: ['systemId'],
      });
      return rows.map((r) => r.systemId);
    },
  };
}

export type InstallRegisterRepository = ReturnType<typeof createInstallRegisterRepository>;

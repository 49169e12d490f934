import type { Sequelize, Transaction } from 'sequelize';
import type { CircuitWiring, ComponentRatings } from '@cellwarden/shared';
import { initModels } from '../../server/src/database/models';

// The demo van's install register (invented): what the fitters put in “Moth” and how each circuit is wired.
// Figures are typical of such a build (common practice), chosen so the rules have something to say: the
// heater's fuse sits 1.5 m from the battery, which 33 CFR 183.455(b) does not allow, so that circuit fails.

const COMPONENTS: Record<string, { name: string; ratings: ComponentRatings }> = {
  battery: {
    name: 'LiFePO4 200 Ah with BMS',
    ratings: {
      kind: 'battery',
      chemistry: 'lifepo4',
      capacityAh: 200,
      bmsContinuousA: 150,
      bmsPeakA: 300,
      bmsPeakSeconds: 10,
    },
  },
  shore: {
    name: 'Shore-power charger 10 A',
    ratings: {
      kind: 'charge-source',
      sourceKind: 'shore',
      ratedCurrentA: 10,
      monitorSourceId: 'shore',
      hoursPerDay: 12,
    },
  },
  solar: {
    name: 'Roof solar 200 W',
    ratings: {
      kind: 'charge-source',
      sourceKind: 'solar',
      ratedCurrentA: 20,
      monitorSourceId: 'solar',
      panelWatts: 200,
      hoursPerDay: 1.5,
    },
  },
  dcdc: {
    name: 'DC-DC charger 60 A',
    ratings: {
      kind: 'charge-source',
      sourceKind: 'dc-dc',
      ratedCurrentA: 60,
      monitorSourceId: 'dcdc',
      hoursPerDay: 1,
    },
  },
  inverter: {
    name: 'Inverter 2000 W',
    ratings: { kind: 'inverter', continuousW: 2000, surgeW: 4000, standbyW: 10, efficiency: 0.9 },
  },
  heater: {
    name: 'Diesel air heater',
    ratings: { kind: 'heater', amps: 1.5, hoursPerDay: 12, dutyCycle: 0.6, ac: false },
  },
  fridge: {
    name: 'Compressor fridge',
    ratings: { kind: 'fridge', watts: 45, hoursPerDay: 24, dutyCycle: 0.35, ac: false },
  },
};

const wiring = (
  over: Partial<CircuitWiring> & Pick<CircuitWiring, 'name'>,
): Omit<CircuitWiring, 'componentId'> => ({
  conductor: { awg: '4' },
  construction: 'stranded',
  oneWayLengthM: 1,
  insulationRatingC: 105,
  location: 'general',
  ambientC: 30,
  bundledConductors: 2,
  protection: { device: 'fuse', ratingA: 80, type: 'MIDI' },
  fuseDistanceM: 0.15,
  sheathed: false,
  designCurrentA: null,
  allowedDropPercent: 3,
  monitoring: 'none',
  ...over,
});

const CIRCUITS: { feeds: keyof typeof COMPONENTS; wiring: Omit<CircuitWiring, 'componentId'> }[] = [
  {
    feeds: 'battery',
    wiring: wiring({
      name: 'Main battery feed',
      conductor: { awg: '2/0' },
      protection: { device: 'fuse', ratingA: 250, type: 'MRBF' },
      fuseDistanceM: 0,
      monitoring: 'battery-feed',
    }),
  },
  {
    feeds: 'dcdc',
    wiring: wiring({ name: 'DC-DC charger output', oneWayLengthM: 2.5, monitoring: 'source' }),
  },
  {
    feeds: 'inverter',
    wiring: wiring({
      name: 'Inverter feed',
      conductor: { awg: '2/0' },
      oneWayLengthM: 1.5,
      protection: { device: 'fuse', ratingA: 250, type: 'ANL' },
    }),
  },
  {
    feeds: 'heater',
    // The glow plug draws about 10 A for the first minutes of a start (common practice figure).
    wiring: wiring({
      name: 'Heater feed',
      conductor: { awg: '12' },
      oneWayLengthM: 3,
      protection: { device: 'fuse', ratingA: 15, type: 'blade' },
      fuseDistanceM: 1.5,
      designCurrentA: 10,
    }),
  },
];

/** Seeds the van's register through the models, inside the scenario's transaction. */
export async function seedDemoInstallRegister(
  sequelize: Sequelize,
  systemId: string,
  transaction: Transaction,
): Promise<void> {
  const { InstallComponent, InstallCircuit } = initModels(sequelize);
  const ids: Record<string, string> = {};
  for (const [key, { name, ratings }] of Object.entries(COMPONENTS))
    ids[key] = (
      await InstallComponent.create({ systemId, name, kind: ratings.kind, ratings }, { transaction })
    ).id;
  for (const { feeds, wiring: w } of CIRCUITS)
    await InstallCircuit.create(
      {
        systemId,
        componentId: ids[feeds],
        name: w.name,
        conductorAwg: w.conductor.awg ?? null,
        conductorMm2: w.conductor.mm2 ?? null,
        construction: w.construction,
        oneWayLengthM: w.oneWayLengthM,
        insulationRatingC: w.insulationRatingC,
        location: w.location,
        ambientC: w.ambientC,
        bundledConductors: w.bundledConductors,
        protectionDevice: w.protection.device,
        protectionRatingA: w.protection.ratingA,
        protectionType: w.protection.type,
        fuseDistanceM: w.fuseDistanceM,
        sheathed: w.sheathed,
        designCurrentA: w.designCurrentA,
        allowedDropPercent: w.allowedDropPercent,
        monitoring: w.monitoring,
      },
      { transaction },
    );
}

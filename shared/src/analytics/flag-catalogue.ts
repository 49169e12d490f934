// Plain-words explanations of each flag for the people living with the battery. Advice stays within what a
// monitor can responsibly say: it points at the BMS, the manufacturer's instructions and qualified help.
import { FlagKind } from './flag-event';

/** What a flag is called, what it means and what to do about it. */
export interface FlagDescription {
  title: string;
  meaning: string;
  whatToDo: string;
}

const MONITOR_ONLY =
  'Cellwarden only watches the battery; the battery management system (BMS) is what protects it.';

const CATALOGUE: Readonly<Record<FlagKind, FlagDescription>> = {
  'low-charge': {
    title: 'Battery charge is low',
    meaning: 'The state of charge has fallen below the level set for this system.',
    whatToDo:
      'Switch off loads you can do without and start charging (engine, shore power or solar) when you can.',
  },
  'low-voltage': {
    title: 'Battery voltage is low',
    meaning:
      'Even allowing for the voltage drop a load causes, the battery voltage is near the point where it should stop supplying power.',
    whatToDo: `Reduce the load now and recharge soon. ${MONITOR_ONLY}`,
  },
  'cold-charging': {
    title: 'Charging a battery that is too cold',
    meaning:
      'Current is flowing into the battery while it is below its minimum charging temperature (0 °C for LiFePO4). Charging lithium cells below freezing damages them permanently.',
    whatToDo: `Stop charging (switch off the charger or DC-DC, disconnect solar) or warm the battery first. ${MONITOR_ONLY}`,
  },
  'cold-charge-ahead': {
    title: 'Battery will soon be too cold to charge',
    meaning:
      'The battery is cooling and, at this rate, will reach its minimum charging temperature soon while charging.',
    whatToDo: 'Insulate or heat the battery space, or plan to stop charging before it gets that cold.',
  },
  'hot-charging': {
    title: 'Charging a battery that is too hot',
    meaning:
      "Current is flowing into the battery while it is above its maximum charging temperature (about 45 °C for LiFePO4). Charging hot cells ages them fast, and many battery makers' BMS stop charging at this point.",
    whatToDo: `Reduce or stop charging until the battery has cooled, and ventilate the battery space. ${MONITOR_ONLY}`,
  },
  'cold-charge-current': {
    title: 'Charge current too high for a cold battery',
    meaning:
      'The battery is above freezing but still cold (below about 10 °C for LiFePO4), where cell makers allow only a reduced charge current, and the charge current is above that.',
    whatToDo:
      "Turn the charger or DC-DC down (many have a low-temperature or reduced-current setting) or warm the battery first. Follow the battery manufacturer's instructions.",
  },
  'over-temperature': {
    title: 'Battery is too hot',
    meaning: 'The battery temperature is above the safe level for this chemistry.',
    whatToDo: `Reduce charging and heavy loads, ventilate the battery space, and keep heat sources away. ${MONITOR_ONLY}`,
  },
  'over-discharge': {
    title: 'Drawing more current than the BMS is rated for',
    meaning: 'The discharge current is above the continuous rating set for the battery management system.',
    whatToDo: 'Switch off some heavy loads (inverter, heater, kettle) so they do not all run at once.',
  },
  'bms-cutoff-suspected': {
    title: 'Battery may have switched itself off',
    meaning:
      'Voltage or current collapsed to almost nothing while power was being drawn, which is what happens when a BMS disconnects the battery.',
    whatToDo:
      "Switch off loads, let the battery rest, and follow the battery manufacturer's instructions to reset it. If it keeps happening, have the system checked by a qualified installer.",
  },
  'device-silent': {
    title: 'No readings from the monitor',
    meaning:
      'The battery monitor has not sent a reading for a while, so the values shown may be out of date.',
    whatToDo: 'Check that the monitor has power and a network connection.',
  },
  'charger-under-delivering': {
    title: 'A charger is delivering less than expected',
    meaning:
      'While the battery is still in the bulk stage, a charge source is supplying well under its rated current.',
    whatToDo:
      "Check the source's wiring, fuse and settings, and whether it is limiting output because it is hot. Follow its manufacturer's instructions.",
  },
  'soc-disagreement': {
    title: 'State of charge readings disagree',
    meaning:
      "The battery's own state of charge and Cellwarden's estimate differ by more than the set margin.",
    whatToDo:
      'Charge the battery fully once so both can re-sync; check the battery capacity entered for this system.',
  },
  'circuit-near-rating': {
    title: 'A circuit’s current is near or over a rating',
    meaning:
      'A current the monitor measured on a registered circuit reached 80 % or more of its fuse, its conductor or the BMS rating (critical once over it). The install register says which circuit and which rating.',
    whatToDo:
      'Spread heavy loads over time, and have the circuit’s conductor and fuse checked against the loads by a qualified installer, following local codes and the manufacturers’ instructions. Never fit a larger fuse than the conductor allows.',
  },
};

/** The plain-words description of a flag kind. */
export function describeFlag(kind: FlagKind): FlagDescription {
  return CATALOGUE[kind];
}

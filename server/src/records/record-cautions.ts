/** The safety cautions every commissioning record carries, in our own words. */
export const RECORD_CAUTIONS: readonly string[] = [
  "Fit a fuse or breaker as close to the battery positive terminal as practical, rated for the cable it protects and for the battery's short-circuit current.",
  'Size every cable for the current it carries and for its voltage drop over the length of the run.',
  'DC arcs do not stop at a zero crossing as AC arcs do: use DC-rated switches, fuses and breakers, and isolate the battery before working on it.',
  'Never charge a LiFePO4 battery below 0 °C unless its manufacturer allows it and its BMS enforces the limit.',
  'This record lists measurements made on the day. It is not a certificate of compliance and not an inspection.',
  "Follow local codes, the manufacturers' instructions and licensed practice; have the work inspected where the rules require it.",
  'Cellwarden monitors the system. It never replaces the battery management system (BMS) or its protections.',
];

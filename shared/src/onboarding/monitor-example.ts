// The copyable example shown with a new monitor's credentials: one SenML reading pack and the
// mosquitto_pub command that sends it, so an installer can prove the path before wiring the real monitor.
import { readingsTopic } from '../telemetry/topics';

/** What the example needs: where the broker is and who the monitor is. */
export interface MonitorExampleInput {
  /** mqtt://host:port or mqtts://host:port. */
  brokerUrl: string;
  deviceId: string;
  password: string;
}

/** A SenML pack and a shell command that publishes it, and the project's simulator playing this monitor. */
export interface MonitorExample {
  payload: string;
  command: string;
  /** Run in a Cellwarden checkout: a simulated bank reports as this monitor until stopped. */
  simulatorCommand: string;
}

/** The simulator scenario offered for a new monitor: a 12 V bank with a 60 A DC-DC charger on a workshop engine. */
export const EXAMPLE_SCENARIO = 'charger-commissioning';

// POSIX sh single quotes: nothing inside is special; a quote itself is closed, escaped and reopened.
const shellQuote = (text: string) => `'${text.replace(/'/g, `'\\''`)}'`;

/**
 * A reading pack without a base time: RFC 8428 §4.5.3 reads a missing time as "roughly now", so the same
 * command still works when it is pasted an hour later. Values are a resting 12 V-class battery scaled to
 * the system's nominal voltage.
 */
export function examplePayload(deviceId: string, nominalVoltage: number): string {
  const voltage = Math.round(13.2 * (nominalVoltage / 12) * 100) / 100;
  return JSON.stringify([
    { bn: `urn:dev:cw:${deviceId}:`, n: 'voltage', u: 'V', v: voltage },
    { n: 'current', u: 'A', v: 1.5 },
    { n: 'temperature', u: 'Cel', v: 18 },
  ]);
}

/** The example for a monitor; throws on a broker URL that is not mqtt:// or mqtts://. */
export function monitorExample(input: MonitorExampleInput, nominalVoltage = 12): MonitorExample {
  const url = new URL(input.brokerUrl);
  const secure = url.protocol === 'mqtts:';
  if (!secure && url.protocol !== 'mqtt:')
    throw new Error(`the broker URL must be mqtt:// or mqtts://; got ${url.protocol}`);
  const port = url.port || (secure ? '8883' : '1883');
  const payload = examplePayload(input.deviceId, nominalVoltage);
  const parts = [
    'mosquitto_pub',
    `-h ${shellQuote(url.hostname.replace(/^\[|\]$/g, ''))}`,
    `-p ${port}`,
    ...(secure ? ['--capath /etc/ssl/certs'] : []),
    `-i ${shellQuote(input.deviceId)}`,
    `-u ${shellQuote(input.deviceId)}`,
    `-P ${shellQuote(input.password)}`,
    `-q 1`,
    `-t ${shellQuote(readingsTopic(input.deviceId))}`,
    `-m ${shellQuote(payload)}`,
  ];
  const simulator = [
    'npm run simulate --',
    `--broker ${shellQuote(`${secure ? 'mqtts' : 'mqtt'}://${url.host}`)}`,
    `--device ${shellQuote(`${input.deviceId}:${input.password}`)}`,
    `--scenario ${EXAMPLE_SCENARIO}`,
    '--interval 5',
  ];
  return { payload, command: parts.join(' '), simulatorCommand: simulator.join(' ') };
}

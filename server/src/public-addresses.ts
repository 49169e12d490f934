import type { Config } from './config';

/**
 * Where people and monitors reach this node: the dashboard's address (links in e-mails) and the broker's
 * (shown with a monitor's credentials). Either may depend on a port that is known only once HTTP or the broker
 * listens (port 0 in tests), so the services get getters and the composition root reports each port here as
 * it binds, instead of keeping late-bound variables of its own. Before HTTP listens, `publicUrl()` is '' unless
 * PUBLIC_URL is configured; no link is written before then.
 */
export function createPublicAddresses(config: Pick<Config, 'HOST' | 'PUBLIC_URL' | 'MQTT_PUBLIC_URL'>) {
  let httpPort = 0;
  let mqttPort = 0;
  const brokerHost = config.PUBLIC_URL ? new URL(config.PUBLIC_URL).hostname : config.HOST;
  return {
    publicUrl: (): string => config.PUBLIC_URL || (httpPort ? `http://${config.HOST}:${httpPort}` : ''),
    brokerPort: (): number => mqttPort,
    brokerUrl: (): string => config.MQTT_PUBLIC_URL?.replace(/\/$/, '') ?? `mqtt://${brokerHost}:${mqttPort}`,
    httpListening(port: number): void {
      httpPort = port;
    },
    brokerListening(port: number): void {
      mqttPort = port;
    },
  };
}

export type PublicAddresses = ReturnType<typeof createPublicAddresses>;

import { loadConfig } from './config';
import { createLogger } from './logger';
import { startServer } from './compose-server';

// The only place that reads the environment, listens, and handles process signals.
async function main() {
  const config = loadConfig(process.env);
  const logger = createLogger(config.LOG_LEVEL);
  const server = await startServer(config, logger);
  logger.info('cellwarden server listening', {
    http: `http://${config.HOST}:${server.httpPort}`,
    mqtt: `mqtt://${config.HOST}:${server.mqttPort}`,
  });
  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.info('stopping', { signal });
    await server.stop();
    process.exit(0);
  };
  process.on('SIGINT', () => void stop('SIGINT'));
  process.on('SIGTERM', () => void stop('SIGTERM'));
}

main().catch((error) => {
  process.stderr.write(`cellwarden server failed to start: ${error?.stack ?? error}\n`);
  process.exit(1);
});

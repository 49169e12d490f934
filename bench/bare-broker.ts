// A bare aedes broker (no authentication, no storage): the ceiling of MQTT alone on this machine.
import { Aedes } from 'aedes';
import { createServer, type AddressInfo } from 'node:net';

async function main() {
  const broker = await Aedes.createBroker();
  const server = createServer(broker.handle);
  server.listen(0, '127.0.0.1', () => {
    process.stdout.write(`${(server.address() as AddressInfo).port}\n`);
  });
  process.on('SIGTERM', () => {
    server.close();
    broker.close(() => process.exit(0));
  });
}

void main();

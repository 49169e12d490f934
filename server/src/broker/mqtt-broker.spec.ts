import type { Aedes, Client, PublishPacket } from 'aedes';
import { skipRoutingOfReadings } from './mqtt-broker';

/** A broker whose own publish records what it was asked to route. */
function routingBroker() {
  const routed: string[] = [];
  const broker = {
    publish(packet: PublishPacket, client: unknown, done?: (error?: Error | null) => void) {
      routed.push(packet.topic);
      (typeof client === 'function' ? client : done)?.(null);
    },
  };
  skipRoutingOfReadings(broker as unknown as Aedes);
  const publish = broker.publish as (
    packet: Partial<PublishPacket>,
    client: unknown,
    done?: (error?: Error | null) => void,
  ) => void;
  return { publish, routed };
}

const device = { id: 'van-1' } as Client;

describe('skipRoutingOfReadings', () => {
  it("ends a device's readings publish once acknowledged, without routing it", () => {
    const { publish, routed } = routingBroker();
    const done = jest.fn();
    publish({ topic: 'cellwarden/v1/devices/van-1/readings', qos: 1 }, device, done);
    expect(routed).toEqual([]);
    expect(done).toHaveBeenCalledWith(null);
  });

  it("routes the broker's own messages and any other topic as before", () => {
    const { publish, routed } = routingBroker();
    const done = jest.fn();
    publish({ topic: '$SYS/broker/new/clients' }, done);
    publish({ topic: 'cellwarden/v1/devices/van-1/readings' }, null, done);
    publish({ topic: 'elsewhere' }, device, done);
    expect(routed).toEqual(['$SYS/broker/new/clients', 'cellwarden/v1/devices/van-1/readings', 'elsewhere']);
    expect(done).toHaveBeenCalledTimes(3);
  });
});

import { parseReadingPayload } from '../senml/reading-pack';
import { examplePayload, monitorExample } from './monitor-example';

const input = { brokerUrl: 'mqtt://broker.example:1884', deviceId: 'van-shunt-1', password: 's3cr-et_x' };

describe('monitor example', () => {
  it('is a pack Cellwarden accepts as one reading of that device, measured about now', () => {
    const now = Date.UTC(2026, 11, 3, 12);
    const { readings } = parseReadingPayload(new TextEncoder().encode(examplePayload('van-shunt-1', 24)), {
      now,
      expectedDeviceId: 'van-shunt-1',
    });
    expect(readings).toHaveLength(1);
    // RFC 8428 §4.5.3: a record without a time was measured "roughly now".
    expect(readings[0].measuredAt).toBe(now);
    expect(readings[0].voltage).toBeCloseTo(26.4, 5);
    expect(readings[0].current).toBe(1.5);
  });

  it('publishes to the device topic with its id as client id and user, at QoS 1, on the given host and port', () => {
    const { command } = monitorExample(input);
    expect(command).toMatch(/^mosquitto_pub -h 'broker\.example' -p 1884 /);
    expect(command).toContain("-i 'van-shunt-1' -u 'van-shunt-1' -P 's3cr-et_x' -q 1");
    expect(command).toContain("-t 'cellwarden/v1/devices/van-shunt-1/readings'");
    expect(command).toContain(`-m '${examplePayload('van-shunt-1', 12)}'`);
  });

  it('adds the system CA path for mqtts and takes the scheme default port', () => {
    // OASIS MQTT 3.1.1 §4.2 and IANA: 1883 for MQTT, 8883 for MQTT over TLS.
    expect(monitorExample({ ...input, brokerUrl: 'mqtts://broker.example' }).command).toContain(
      "-h 'broker.example' -p 8883 --capath /etc/ssl/certs",
    );
    expect(monitorExample({ ...input, brokerUrl: 'mqtt://10.0.0.5' }).command).toContain('-p 1883');
  });

  it('quotes a password with a quote in it so the shell passes it unchanged', () => {
    expect(monitorExample({ ...input, password: "it's" }).command).toContain(`-P 'it'\\''s'`);
  });

  it('refuses a broker URL of another scheme', () => {
    expect(() => monitorExample({ ...input, brokerUrl: 'http://x' })).toThrow(/mqtt:\/\/ or mqtts:\/\//);
  });

  it('offers the project simulator playing this monitor against the same broker', () => {
    expect(monitorExample(input).simulatorCommand).toBe(
      "npm run simulate -- --broker 'mqtt://broker.example:1884' --device 'van-shunt-1:s3cr-et_x' " +
        '--scenario charger-commissioning --interval 5',
    );
  });
});

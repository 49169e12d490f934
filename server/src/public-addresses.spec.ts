import { createPublicAddresses } from './public-addresses';

describe('public addresses', () => {
  it('points links at HOST and the bound HTTP port when no PUBLIC_URL is configured, and at nothing before', () => {
    const addresses = createPublicAddresses({ HOST: '127.0.0.1' });
    expect(addresses.publicUrl()).toBe('');
    addresses.httpListening(41234);
    expect(addresses.publicUrl()).toBe('http://127.0.0.1:41234');
  });

  it('keeps a configured PUBLIC_URL and takes the broker host from it, with the bound MQTT port', () => {
    const addresses = createPublicAddresses({ HOST: '0.0.0.0', PUBLIC_URL: 'https://monitor.example.test' });
    addresses.httpListening(8080);
    addresses.brokerListening(41883);
    expect(addresses.publicUrl()).toBe('https://monitor.example.test');
    expect(addresses.brokerPort()).toBe(41883);
    expect(addresses.brokerUrl()).toBe('mqtt://monitor.example.test:41883');
  });

  it('gives a configured MQTT_PUBLIC_URL without its trailing slash, whatever port the broker bound', () => {
    const addresses = createPublicAddresses({
      HOST: '127.0.0.1',
      MQTT_PUBLIC_URL: 'mqtts://mqtt.example.test:8883/',
    });
    addresses.brokerListening(1883);
    expect(addresses.brokerUrl()).toBe('mqtts://mqtt.example.test:8883');
  });
});

// Cellwarden's MQTT topic layout, version 1. A device publishes only beneath its own id.

/** First topic level of every Cellwarden topic; the version lets a later layout live beside this one. */
export const TOPIC_ROOT = 'cellwarden/v1';

/** Topic a device publishes its SenML reading packs to. */
export function readingsTopic(deviceId: string): string {
  return `${TOPIC_ROOT}/devices/${deviceId}/readings`;
}

/** The device id in a readings topic, or undefined when the topic is not a readings topic. */
export function deviceIdFromReadingsTopic(topic: string): string | undefined {
  const match = /^cellwarden\/v1\/devices\/([^/+#]+)\/readings$/.exec(topic);
  return match?.[1];
}

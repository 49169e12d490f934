/**
 * The device id rule of the API contract: lowercase letters, digits and dashes, 3 to 63 characters,
 * starting with a letter or digit (it becomes an MQTT topic level and the MQTT username).
 */
export const DEVICE_ID_PATTERN = /^[a-z0-9][a-z0-9-]{2,62}$/;

// RFC 8428 §4.5.1: a resolved name uses only A-Z a-z 0-9 - : . / _ and starts with a letter or digit.
const SENML_NAME = /^[A-Za-z0-9][A-Za-z0-9\-:./_]*$/;

/** Whether a resolved (base name + name) string is a valid SenML name. */
export function isSenmlName(name: string): boolean {
  return SENML_NAME.test(name);
}

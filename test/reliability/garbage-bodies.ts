import fc from 'fast-check';

/** A route under test, its path built from (possibly garbage) path parameters, and the keys it reads. */
export interface GarbageRoute {
  method: 'post' | 'put';
  path: (params: { systemId: string; alertId: string }) => string;
  keys: string[];
  /** Who calls it: a signed-in owner, a company admin, or nobody. */
  as: 'owner' | 'admin' | 'anonymous';
}

/** The body-taking routes of the API, with the keys each one's validator looks at. */
export const GARBAGE_ROUTES: GarbageRoute[] = [
  { method: 'post', path: () => '/api/auth/sign-in', keys: ['email', 'password'], as: 'anonymous' },
  { method: 'post', path: () => '/api/auth/password-reset/request', keys: ['email'], as: 'anonymous' },
  {
    method: 'post',
    path: () => '/api/auth/password-reset/complete',
    keys: ['token', 'password'],
    as: 'anonymous',
  },
  {
    method: 'post',
    path: () => '/api/auth/invitations/accept',
    keys: ['token', 'displayName', 'password'],
    as: 'anonymous',
  },
  {
    method: 'post',
    path: (p) => `/api/systems/${p.systemId}/grants`,
    keys: ['granteeCompanyId', 'granteeEmail', 'access', 'expiresAt'],
    as: 'owner',
  },
  { method: 'post', path: (p) => `/api/systems/${p.systemId}/devices`, keys: ['id', 'label'], as: 'owner' },
  {
    method: 'put',
    path: (p) => `/api/systems/${p.systemId}/settings`,
    keys: ['name', 'kind', 'timeZone', 'battery', 'bms', 'chargeSources', 'thresholds'],
    as: 'owner',
  },
  { method: 'put', path: () => '/api/me/preferences', keys: ['temperatureUnit', 'emailFlags'], as: 'owner' },
  {
    method: 'post',
    path: (p) => `/api/systems/${p.systemId}/alerts/${p.alertId}/acknowledge`,
    keys: ['note'],
    as: 'owner',
  },
  { method: 'post', path: () => '/api/company/invitations', keys: ['email', 'roles'], as: 'admin' },
];

// Strings that break naive code: every code point including controls, CR/LF, formula prefixes, long runs.
const nastyString = fc.oneof(
  fc.string({ unit: 'binary', maxLength: 40 }),
  fc.constantFrom(
    '',
    ' ',
    '\r\nBcc: victim@elsewhere.example',
    '=HYPERLINK("http://x.invalid")',
    '\u202Egnp.exe',
    '\u0000',
    "' OR 1=1 --",
    '../../etc/passwd',
    '{{7*7}}',
    '\uD800',
    'a'.repeat(5000),
  ),
);

const nastyValue: fc.Arbitrary<unknown> = fc.oneof(
  nastyString,
  fc.double(),
  fc.constantFrom(0, -1, 1e308, -1e308, 2 ** 53 + 1, true, false, null),
  fc.array(nastyString, { maxLength: 5 }),
  fc.jsonValue({ maxDepth: 3 }),
);

/** A JSON body for `keys`: the right keys with garbage values, stray keys, or not an object at all. */
export function garbageBody(keys: string[]): fc.Arbitrary<unknown> {
  const known = fc.dictionary(fc.constantFrom(...keys), nastyValue, { maxKeys: keys.length });
  const stray = fc.dictionary(
    fc.oneof(nastyString, fc.constantFrom('__proto__', 'constructor')),
    nastyValue,
    {
      maxKeys: 4,
    },
  );
  return fc.oneof(
    known,
    fc.tuple(known, stray).map(([a, b]) => ({ ...b, ...a })),
    fc.array(nastyValue, { maxLength: 4 }),
    fc.jsonValue({ maxDepth: 4 }),
  );
}

/** Raw bodies sent as application/json that are not JSON, or JSON no handler expects. */
export const RAW_GARBAGE = [
  '{',
  '{"email":',
  'null',
  '"text"',
  '42',
  '[]',
  '\u0000',
  '{"a":1}'.repeat(3),
  'x'.repeat(300_000),
];

/** A path parameter: a real id, a well-formed id of nothing, or junk. */
export function pathParameter(realId: string): fc.Arbitrary<string> {
  return fc.oneof(
    fc.constant(realId),
    fc.uuid(),
    nastyString.filter((s) => s.length > 0 && s.length < 200).map(pathSafe),
  );
}

// A lone surrogate cannot be percent-encoded (URIError); such a string is sent as a plain junk id instead.
function pathSafe(text: string): string {
  try {
    return encodeURIComponent(text);
  } catch {
    return 'not-an-id';
  }
}

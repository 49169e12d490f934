import { randomBytes } from 'node:crypto';

/**
 * The signing secret of the servers one test file starts: `npm test` passes one random value to every
 * process; a file run on its own makes its own. Never a value written in the repository.
 */
export const TEST_JWT_SECRET = process.env.JWT_SECRET ?? randomBytes(32).toString('base64url');

import { connectAsync } from 'mqtt';
import { run } from './run';
run(process.argv.slice(2), {
  connect: connectAsync,
  now: Date.now,
  sleep: (ms) => new Promise((resolve) => setTimeout(resolve, ms)),
  stdout: (s) => process.stdout.write(s),
  stderr: (s) => process.stderr.write(s),
}).then((code) => process.exit(code));

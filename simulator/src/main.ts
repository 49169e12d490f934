import { nodeRunDeps } from './node-run-deps';
import { run } from './run';
run(process.argv.slice(2), nodeRunDeps()).then((code) => process.exit(code));

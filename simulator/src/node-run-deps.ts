import { connectAsync } from 'mqtt';
import { RunDeps } from './run';

/** The real world for `run`: mqtt.js, the wall clock, timers and the process's streams. */
export function nodeRunDeps(): RunDeps {
  return {
    connect: connectAsync,
    now: Date.now,
    sleep: (ms) => new Promise((resolve) => setTimeout(resolve, ms)),
    stdout: (text) => process.stdout.write(text),
    stderr: (text) => process.stderr.write(text),
  };
}

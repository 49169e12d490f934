// Small process helpers shared by `npm start` and `npm test`. Node built-ins only.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';

export const projectRoot = resolve(import.meta.dirname, '..', '..');
export const bin = (name) => join(projectRoot, 'node_modules', '.bin', name);

/** Installs dependencies from the lockfile when node_modules is missing or older than the lockfile. */
export function ensureDependencies(log = console.log) {
  const marker = join(projectRoot, 'node_modules', '.package-lock.json');
  const lock = join(projectRoot, 'package-lock.json');
  if (existsSync(marker) && statSync(marker).mtimeMs >= statSync(lock).mtimeMs) return;
  log('Installing dependencies (npm ci)…');
  const result = spawnSync('npm', ['ci', '--no-audit', '--no-fund'], { cwd: projectRoot, stdio: 'inherit' });
  if (result.status !== 0) throw new Error('npm ci failed');
}

/** Runs a command to completion, inheriting output; throws on a non-zero exit. */
export function runStep(label, command, args, env = {}) {
  const result = spawnSync(command, args, {
    cwd: projectRoot,
    stdio: 'inherit',
    env: { ...process.env, ...env },
  });
  if (result.status !== 0) throw new Error(`${label} failed (exit ${result.status ?? result.signal})`);
}

/** Newest modification time of any file below the folders. */
export function newestMtime(folders) {
  let newest = 0;
  const walk = (path) => {
    const stat = statSync(path);
    if (stat.isDirectory()) for (const entry of readdirSync(path)) walk(join(path, entry));
    else newest = Math.max(newest, stat.mtimeMs);
  };
  for (const folder of folders) if (existsSync(folder)) walk(folder);
  return newest;
}

/** Builds the dashboard when its sources are newer than the last build. */
export function ensureWebBuild(log = console.log) {
  const index = join(projectRoot, 'dist', 'web', 'browser', 'index.html');
  const sources = ['web', 'shared/src'].map((f) => join(projectRoot, f));
  const configs = ['angular.json', 'tsconfig.json', 'tsconfig.web.json', 'package-lock.json'].map((f) =>
    join(projectRoot, f),
  );
  if (
    existsSync(index) &&
    statSync(index).mtimeMs > Math.max(newestMtime(sources), ...configs.map((c) => statSync(c).mtimeMs))
  )
    return;
  log('Building the dashboard…');
  runStep('dashboard build', bin('ng'), ['build'], { NG_CLI_ANALYTICS: 'false' });
}

/** Starts a long-running child with prefixed output. */
export function startChild(label, command, args, env = {}) {
  const child = spawn(command, args, {
    cwd: projectRoot,
    env: { ...process.env, ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const prefix = (stream, target) =>
    stream.on('data', (chunk) => {
      for (const line of chunk.toString().split('\n')) if (line) target.write(`[${label}] ${line}\n`);
    });
  prefix(child.stdout, process.stdout);
  prefix(child.stderr, process.stderr);
  return child;
}

/** Waits until the URL answers 200, or throws after `timeoutMs`. */
export async function waitForHttp(url, timeoutMs = 60000) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    try {
      const response = await fetch(url);
      if (response.ok) return;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`${url} did not answer within ${timeoutMs / 1000} s`);
}

import { readdirSync, readFileSync } from 'node:fs';

// Linux /proc accounting: utime and stime are fields 14 and 15 of /proc/<pid>/stat, in clock ticks (100 a
// second on Linux, the USER_HZ every distribution ships; proc(5)). A process that exits between two samples
// takes its CPU with it, so short-lived PostgreSQL workers are undercounted, never overcounted.
const TICK_MS = 10;

function cpuMsOf(pid: number): number {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    // The command name (field 2) may hold spaces; the fields after its closing parenthesis are fixed.
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    return (Number(fields[11]) + Number(fields[12])) * TICK_MS;
  } catch {
    return 0;
  }
}

function childrenOf(parent: number): number[] {
  const children: number[] = [];
  for (const entry of readdirSync('/proc')) {
    if (!/^\d+$/.test(entry)) continue;
    try {
      const stat = readFileSync(`/proc/${entry}/stat`, 'utf8');
      if (Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[1]) === parent)
        children.push(Number(entry));
    } catch {
      // gone already
    }
  }
  return children;
}

/** CPU time of named parties (a process, or a process and its children), between `start()` and `stop()`. */
export function cpuMeter(parties: Record<string, { pid: number; withChildren?: boolean }>) {
  const sample = () =>
    Object.fromEntries(
      Object.entries(parties).map(([name, { pid, withChildren }]) => {
        const pids = withChildren ? [pid, ...childrenOf(pid)] : [pid];
        return [name, new Map(pids.map((p) => [p, cpuMsOf(p)]))];
      }),
    );
  let before = sample();
  return {
    start() {
      before = sample();
    },
    /** Milliseconds of CPU each party used since `start()` (a process started since counts in full). */
    stop(): Record<string, number> {
      const after = sample();
      return Object.fromEntries(
        Object.entries(after).map(([name, pids]) => [
          name,
          [...pids].reduce(
            (sum, [pid, ms]) => sum + (before[name].has(pid) ? ms - before[name].get(pid)! : ms),
            0,
          ),
        ]),
      );
    },
  };
}

/** The postmaster's pid, from the cluster's own postmaster.pid (its first line). */
export function postmasterPid(dataDirectory: string): number {
  return Number(readFileSync(`${dataDirectory}/postmaster.pid`, 'utf8').split('\n')[0]);
}

/** The whole machine's busy CPU time (all cores, every process), from the first line of /proc/stat. */
function machineBusyMs(): number {
  // cpu  user nice system idle iowait irq softirq steal …, in clock ticks; idle and iowait are not busy.
  const [user, nice, system, , , irq, softirq, steal] = readFileSync('/proc/stat', 'utf8')
    .split('\n')[0]
    .trim()
    .split(/\s+/)
    .slice(1, 9)
    .map(Number);
  return (user + nice + system + irq + softirq + steal) * TICK_MS;
}

/**
 * How many cores the whole machine kept busy while `work` ran: for a ceiling whose clients come and go
 * (their PostgreSQL backends exit before a per-process sample could count them).
 */
export async function coresBusyDuring<T>(work: () => Promise<T>): Promise<{ result: T; cores: number }> {
  const busyBefore = machineBusyMs();
  const started = performance.now();
  const result = await work();
  return { result, cores: (machineBusyMs() - busyBefore) / (performance.now() - started) };
}

// CPU time spent by the processes under load, read from /proc (Linux; elsewhere it is simply not
// reported). CPU milliseconds per request or per message say where the time goes whatever else
// runs on the machine, which wall-clock figures alone cannot when the machine is shared.
import fs from 'node:fs';
import path from 'node:path';

const TICK_MS = 10; // USER_HZ is 100 on Linux

/** utime + stime (+ the reaped children's), in ms; null when the process is gone or there is no /proc. */
function cpuMsOf(pid: number, withChildren: boolean): number | null {
  try {
    const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
    // Fields after the command (which may hold spaces) start after the last ')'.
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    const [utime, stime, cutime, cstime] = [11, 12, 13, 14].map((i) => Number(fields[i]));
    return (utime + stime + (withChildren ? cutime + cstime : 0)) * TICK_MS;
  } catch {
    return null;
  }
}

function childrenOf(parent: number): number[] {
  try {
    return fs
      .readdirSync('/proc')
      .filter((d) => /^\d+$/.test(d))
      .map(Number)
      .filter((pid) => {
        try {
          const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
          return Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[1]) === parent;
        } catch {
          return false;
        }
      });
  } catch {
    return [];
  }
}

export interface CpuProbe {
  /** CPU ms since the probe was made */
  read(): number | null;
}

/** One process (a Node child of the bench). */
export function processCpu(pid: number): CpuProbe {
  const start = cpuMsOf(pid, false);
  return { read: () => (start === null ? null : (cpuMsOf(pid, false) ?? NaN) - start) };
}

/**
 * A whole PostgreSQL cluster: the postmaster, its live backends, and (through the postmaster's
 * reaped-children times) the backends that ended meanwhile.
 */
export function clusterCpu(dataDir: string): CpuProbe {
  const measure = (): number | null => {
    let postmaster: number;
    try {
      postmaster = Number(fs.readFileSync(path.join(dataDir, 'postmaster.pid'), 'utf8').split('\n')[0]);
    } catch {
      return null;
    }
    const own = cpuMsOf(postmaster, true);
    if (own === null) return null;
    return own + childrenOf(postmaster).reduce((sum, pid) => sum + (cpuMsOf(pid, false) ?? 0), 0);
  };
  const start = measure();
  return { read: () => (start === null ? null : (measure() ?? NaN) - start) };
}

/** This process (the load generator). */
export function selfCpu(): CpuProbe {
  const start = process.cpuUsage();
  return {
    read: () => {
      const now = process.cpuUsage(start);
      return (now.user + now.system) / 1000;
    },
  };
}

/**
 * Reads processes from /proc (Linux only): which one listens on a port, its
 * memory, and the CPU time it has used. A service started through tsx runs as
 * a child of the tsx launcher, so the launcher's pid is not the server's.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';

export interface ProcessMemory {
  pid: number;
  /** Resident set size now, in kB (VmRSS). */
  rssKb: number;
  /** The highest resident set size the process has had, in kB (VmHWM). */
  peakRssKb: number;
}

function listeningSocketInodes(port: number): Set<string> {
  const portHex = port.toString(16).toUpperCase().padStart(4, '0');
  const inodes = new Set<string>();
  for (const table of ['/proc/net/tcp', '/proc/net/tcp6']) {
    if (!fs.existsSync(table)) continue;
    for (const line of fs.readFileSync(table, 'utf8').split('\n').slice(1)) {
      const fields = line.trim().split(/\s+/);
      // fields: sl local_address rem_address st ... inode (10th); state 0A is LISTEN.
      if (fields.length > 9 && fields[1]?.endsWith(`:${portHex}`) && fields[3] === '0A') inodes.add(fields[9]!);
    }
  }
  return inodes;
}

export function childrenOf(pid: number): number[] {
  const tasks = `/proc/${pid}/task`;
  if (!fs.existsSync(tasks)) return [];
  return fs.readdirSync(tasks).flatMap((tid) => {
    try {
      return fs.readFileSync(`${tasks}/${tid}/children`, 'utf8').trim().split(/\s+/).filter(Boolean).map(Number);
    } catch {
      return [];
    }
  });
}

function holdsSocket(pid: number, inodes: Set<string>): boolean {
  try {
    return fs.readdirSync(`/proc/${pid}/fd`).some((fd) => {
      try {
        const match = /^socket:\[(\d+)\]$/.exec(fs.readlinkSync(`/proc/${pid}/fd/${fd}`));
        return match !== null && inodes.has(match[1]!);
      } catch {
        return false;
      }
    });
  } catch {
    return false;
  }
}

/** The pid among `root` and its descendants that holds the listening socket on `port`. */
export function listeningPid(root: number, port: number): number {
  const inodes = listeningSocketInodes(port);
  if (inodes.size === 0) throw new Error(`Nothing listens on port ${port}.`);
  const queue = [root];
  while (queue.length > 0) {
    const pid = queue.shift()!;
    if (holdsSocket(pid, inodes)) return pid;
    queue.push(...childrenOf(pid));
  }
  throw new Error(`No process under pid ${root} listens on port ${port}.`);
}

export function processMemory(pid: number): ProcessMemory {
  const status = fs.readFileSync(`/proc/${pid}/status`, 'utf8');
  const kb = (field: string) => {
    const match = new RegExp(`^${field}:\\s+(\\d+) kB`, 'm').exec(status);
    if (match === null) throw new Error(`/proc/${pid}/status has no ${field}.`);
    return Number(match[1]);
  };
  return { pid, rssKb: kb('VmRSS'), peakRssKb: kb('VmHWM') };
}

let ticksPerSecond: number | undefined;
function clockTicks(): number {
  ticksPerSecond ??= Number(execFileSync('getconf', ['CLK_TCK'], { encoding: 'utf8' }).trim()) || 100;
  return ticksPerSecond;
}

/**
 * CPU seconds (user + system) a process has used, plus what its exited and
 * waited-for children used (cutime + cstime): for PostgreSQL's postmaster that
 * covers backends that have come and gone.
 */
function cpuSecondsOf(pid: number, withExitedChildren: boolean): number {
  try {
    const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
    // Fields after the command name (which may hold spaces) start at the last ')'.
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    // utime, stime, cutime, cstime are fields 14–17 of the whole line, 12–15 after the name.
    const [utime, stime, cutime, cstime] = fields.slice(11, 15).map(Number) as [number, number, number, number];
    return (utime + stime + (withExitedChildren ? cutime + cstime : 0)) / clockTicks();
  } catch {
    return 0;
  }
}

/** CPU seconds used so far by a process alone. */
export const processCpuSeconds = (pid: number) => cpuSecondsOf(pid, false);

/** CPU seconds used so far by a process and all its children, living or exited. */
export function treeCpuSeconds(pid: number): number {
  return cpuSecondsOf(pid, true) + childrenOf(pid).reduce((sum, child) => sum + treeCpuSeconds(child), 0);
}

/** The parent of a process (for a PostgreSQL backend, the postmaster). */
export function parentPid(pid: number): number {
  const match = /^PPid:\s+(\d+)/m.exec(fs.readFileSync(`/proc/${pid}/status`, 'utf8'));
  if (match === null) throw new Error(`/proc/${pid}/status has no PPid.`);
  return Number(match[1]);
}

/** CPU seconds all cores of the machine have spent running something since boot (user, nice, system, irq, softirq). */
export function machineBusySeconds(): number {
  const line = fs.readFileSync('/proc/stat', 'utf8').split('\n', 1)[0]!;
  const [user = 0, nice = 0, system = 0, , , irq = 0, softirq = 0] = line.trim().split(/\s+/).slice(1).map(Number);
  return (user + nice + system + irq + softirq) / clockTicks();
}

// CPU time a process has used, from /proc: on a shared machine the wall-clock time of a request
// depends on the neighbours, the CPU time it costs the server much less.
import { readFileSync } from 'node:fs';

/** User plus system CPU time of the process so far (all its threads), in ms. */
export function processCpuMs(pid: number): number {
  const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
  // Fields after the command name, which is in parentheses and may hold spaces.
  const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
  const ticks = Number(fields[11]) + Number(fields[12]); // utime, stime (fields 14 and 15)
  return (ticks * 1000) / 100; // USER_HZ is 100 on Linux
}

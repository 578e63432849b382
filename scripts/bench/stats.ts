// Small helpers for the benchmarks: medians, the machine's description and its load.
import { execFileSync } from 'node:child_process'
import { readFileSync } from 'node:fs'
import os from 'node:os'

export const median = (xs: number[]): number => {
  const s = [...xs].sort((a, b) => a - b)
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2
}

export const loadAverage = (): number[] => os.loadavg().map((l) => Math.round(l * 100) / 100)

export async function timed<T>(work: () => Promise<T>): Promise<{ ms: number; result: T }> {
  const started = process.hrtime.bigint()
  const result = await work()
  return { ms: Number(process.hrtime.bigint() - started) / 1e6, result }
}

/** Runs work while sampling this process's resident memory; answers its time and the peak above the start. */
export async function withPeak<T>(work: () => Promise<T>): Promise<{ ms: number; peakMb: number }> {
  const start = process.memoryUsage().rss
  let peak = start
  const timer = setInterval(() => { peak = Math.max(peak, process.memoryUsage().rss) }, 20)
  try {
    const { ms } = await timed(work)
    peak = Math.max(peak, process.memoryUsage().rss)
    return { ms, peakMb: (peak - start) / 1048576 }
  } finally {
    clearInterval(timer)
  }
}

export interface Machine {
  nproc: number
  cpu: string
  memoryGb: number
  node: string
  mariadb: string
}

export function machine(mariadb: string): Machine {
  const cpu = /model name\s*:\s*(.+)/.exec(readFileSync('/proc/cpuinfo', 'utf8'))?.[1] ?? os.cpus()[0]?.model ?? 'unknown'
  return {
    nproc: Number(execFileSync('nproc').toString().trim()),
    cpu,
    memoryGb: Math.round(os.totalmem() / 2 ** 30),
    node: process.version,
    mariadb,
  }
}

export const describeMachine = (m: Machine) => `nproc ${m.nproc}, CPU ${m.cpu}, ${m.memoryGb} GB, MariaDB ${m.mariadb}, Node ${m.node}`

/**
 * CPU time (user + system, ms) a process has used so far, from /proc/<pid>/stat (fields 14 and 15, in clock
 * ticks of 1/100 s on Linux). Wall time on a shared machine says how busy the machine was; CPU per request
 * says what the request itself cost, and so compares two servers fairly under any load.
 */
export function processCpuMs(pid: number | undefined): number | null {
  if (!pid) return null
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8')
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ')
    return (Number(fields[11]) + Number(fields[12])) * 10
  } catch {
    return null
  }
}

/** The MariaDB server's process id, from the pid file of the instance under .data/ (null when not ours). */
export function mariadbPid(profileName: string, dataRoot: string): number | undefined {
  try {
    return Number(readFileSync(`${dataRoot}/${profileName}/mysqld.pid`, 'utf8').trim()) || undefined
  } catch {
    return undefined
  }
}

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

export interface P99Target {
  maxMs: number
  lumenyardP99: number
  floorP99: number
  holds: boolean
  floorHolds: boolean
  /**
   * Little's law for a closed load (each connection sends its next request when its answer comes): mean latency =
   * connections ÷ throughput. A p99 under the target with a mean above it would need the slowest 1 % to take
   * about a hundred times the target on average, so in practice a p99 under the target needs more than
   * connections ÷ target answers a second: `neededReqPerS`, against which both sides' throughput can be read.
   */
  connections: number
  neededReqPerS: number
  meanMs: { lumenyard: number; floor: number }
  /** Plain words for the run's table and the JSON: who misses, and whether the floor's own p99 says it is the machine. */
  verdict: string
}

/**
 * The p99 target judged with the floor's p99 from the same rounds beside it: when the bare server misses it too, the
 * run says so, since then no change to Lumenyard can meet it on this machine (the load generator, the server and
 * MariaDB share its cores). The target itself, its connections and its seconds stay as they are.
 */
export function judgeP99(maxMs: number, connections: number, l: { median: number; p99: number }, f: { median: number; p99: number }): P99Target {
  const holds = l.p99 < maxMs
  const floorHolds = f.p99 < maxMs
  const neededReqPerS = (connections * 1000) / maxMs
  const meanMs = { lumenyard: (connections * 1000) / l.median, floor: (connections * 1000) / f.median }
  const times = (l.p99 / f.p99).toFixed(1)
  const verdict = holds
    ? `p99 ${l.p99.toFixed(0)} ms < ${maxMs} ms: holds`
    : floorHolds
      ? `p99 ${l.p99.toFixed(0)} ms ≥ ${maxMs} ms while the floor's is ${f.p99.toFixed(0)} ms: the app misses it`
      : `p99 ${l.p99.toFixed(0)} ms ≥ ${maxMs} ms; the floor also misses the target (p99 ${f.p99.toFixed(0)} ms in the same rounds): ` +
        `the machine, not the app, keeps it out of reach here; Lumenyard's p99 is ${times}× the floor's. Under ${maxMs} ms at ` +
        `${connections} connections takes more than ${Math.round(neededReqPerS).toLocaleString('en')} answers/s (mean latency = connections ÷ ` +
        `throughput: Lumenyard ${meanMs.lumenyard.toFixed(0)} ms, floor ${meanMs.floor.toFixed(0)} ms)`
  return { maxMs, lumenyardP99: l.p99, floorP99: f.p99, holds, floorHolds, connections, neededReqPerS, meanMs, verdict }
}


// Child processes for the crash tests and the two-process scale set-up: free ports, an app process
// started from scripts/appProcess.ts, and waiting for its health answer. Every loop is bounded.
import { spawn, type ChildProcess } from 'node:child_process'
import net from 'node:net'
import path from 'node:path'

export const projectRoot = path.resolve(import.meta.dirname, '..', '..')

/** A port nobody listens on now (the OS picks it), unless the variable names one. */
export async function freePort(envName?: string): Promise<number> {
  const fromEnv = envName ? Number(process.env[envName]) : NaN
  if (Number.isInteger(fromEnv) && fromEnv > 0) return fromEnv
  return new Promise((resolve, reject) => {
    const srv = net.createServer()
    srv.once('error', reject)
    srv.listen(0, '127.0.0.1', () => {
      const port = (srv.address() as net.AddressInfo).port
      srv.close(() => resolve(port))
    })
  })
}

export interface AppProcess {
  url: string
  child: ChildProcess
  output: string[]
  /** Ends it at once, as a crash would (SIGKILL). */
  crash(): Promise<void>
  stop(): Promise<void>
}

export async function startAppProcess(env: Record<string, string>, port: number): Promise<AppProcess> {
  // node itself with tsx as a loader, not the tsx command: that one runs the app in a second process,
  // which a SIGKILL of the first would leave running.
  const child = spawn(process.execPath, ['--import', 'tsx', 'scripts/appProcess.ts'], {
    cwd: projectRoot,
    env: { ...process.env, ...env, TSX_TSCONFIG_PATH: 'tsconfig.server.json', LUMENYARD_PORT: String(port), LUMENYARD_HOST: '127.0.0.1' },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  const output: string[] = []
  child.stdout!.on('data', (d: Buffer) => output.push(d.toString()))
  child.stderr!.on('data', (d: Buffer) => output.push(d.toString()))
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()))
  const url = `http://127.0.0.1:${port}`
  await waitFor(async () => (await health(url)) === 200, 90_000, () => `app process did not answer at ${url}:\n${output.join('').slice(-2000)}`, () => child.exitCode !== null)
  return {
    url, child, output,
    crash: async () => { child.kill('SIGKILL'); await exited },
    stop: async () => { if (child.exitCode === null) { child.kill('SIGTERM'); await exited } },
  }
}

export async function health(url: string): Promise<number> {
  try {
    const res = await fetch(`${url}/api/health`, { signal: AbortSignal.timeout(3000) })
    return res.status
  } catch {
    return 0
  }
}

/** Polls until ok() is true, at most `ms`; fails with the message when it never is (or gave up early). */
export async function waitFor(ok: () => Promise<boolean>, ms: number, message: () => string, gaveUp: () => boolean = () => false): Promise<number> {
  const started = Date.now()
  while (Date.now() - started < ms) {
    if (await ok()) return Date.now() - started
    if (gaveUp()) break
    await new Promise((r) => setTimeout(r, 200))
  }
  throw new Error(message())
}

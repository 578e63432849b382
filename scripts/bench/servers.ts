// Starts the servers a benchmark talks to, each in its own Node process: Lumenyard as it runs in
// production (server/main.ts) and the floor (floorServer.ts). Each reports its address over IPC.
import { spawn, type ChildProcess } from 'node:child_process'
import path from 'node:path'
import { projectRoot } from '../embeddedMariadb.js'

export interface BenchServer {
  name: string
  url: string
  child: ChildProcess
  stop(): Promise<void>
}

/** Runs a TypeScript entry under Node with tsx as its loader (so `--cpu-prof` and the like can be added). */
export function startNodeServer(name: string, entry: string, env: Record<string, string>, nodeFlags: string[] = []): Promise<BenchServer> {
  const child = spawn(process.execPath, [...nodeFlags, '--import', 'tsx', path.join(projectRoot, entry)], {
    cwd: projectRoot,
    env: { ...process.env, ...env, TSX_TSCONFIG_PATH: 'tsconfig.server.json' },
    stdio: ['ignore', 'ignore', 'inherit', 'ipc'],
  })
  return new Promise((resolve, reject) => {
    const failed = (code: number | null) => reject(new Error(`${name} stopped before it was ready (exit ${code})`))
    child.once('exit', failed)
    child.once('message', (msg: { url?: string }) => {
      child.off('exit', failed)
      if (!msg.url) return reject(new Error(`${name} did not report its address`))
      resolve({
        name,
        url: msg.url,
        child,
        stop: () =>
          new Promise<void>((done) => {
            if (child.exitCode !== null) return done()
            child.once('exit', () => done())
            child.kill('SIGTERM')
            setTimeout(() => child.kill('SIGKILL'), 5000).unref()
          }),
      })
    })
  })
}

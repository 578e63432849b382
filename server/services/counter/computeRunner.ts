// Runs takeoff computations in a worker thread with a time cap. The schema already refuses takeoffs past
// the limits (shared/takeoff/bounds.ts); this keeps even the largest allowed one off the main thread, and
// a computation that runs past the cap (or out of memory) is stopped and answered, never left hanging.
import { Worker } from 'node:worker_threads'
import type { CounterBill } from '../../../shared/counter/counterBill.js'
import type { CounterCatalog } from '../../../shared/schemas/counter.js'
import type { LengthUnitName, Takeoff } from '../../../shared/schemas/takeoff.js'
import { AppError } from '../../errors.js'

export interface ComputeJob {
  id: number
  takeoff: Takeoff
  catalog: CounterCatalog
  unit: LengthUnitName
  detail: 'full' | 'lean'
}

export type ComputeReply = { id: number; ok: true; bill: CounterBill } | { id: number; ok: false; message: string }

export interface ComputeLimits {
  /** Longest one computation may run before it is stopped. */
  timeMs: number
  /** Computations waiting at once; more are refused (503) rather than queued without end. */
  queue: number
  heapMb: number
}

export const COMPUTE_LIMITS: ComputeLimits = { timeMs: 10_000, queue: 16, heapMb: 512 }

/** Longest the worker may take to load before the computation waiting for it is refused. */
const START_LIMIT_MS = 60_000

interface Pending { job: ComputeJob; resolve: (bill: CounterBill) => void; reject: (err: Error) => void }

// The worker is TypeScript: a small module boot registers tsx's loader, then imports it.
const workerUrl = new URL(import.meta.url.endsWith('.ts') ? './computeWorker.ts' : './computeWorker.js', import.meta.url).href
const bootSource = `import(${JSON.stringify(import.meta.resolve('tsx/esm/api'))}).then((tsx) => { tsx.register(); return import(${JSON.stringify(workerUrl)}) })`

export class ComputeRunner {
  private worker: Worker | null = null
  private ready = false
  private readonly waiting: Pending[] = []
  private running: Pending | null = null
  private timer: NodeJS.Timeout | undefined
  private nextId = 1
  private started = 0

  constructor(private readonly limits: ComputeLimits) {}

  /** Computations handed to the worker since the server started (for logs and tests). */
  get computations(): number {
    return this.started
  }

  run(takeoff: Takeoff, catalog: CounterCatalog, unit: LengthUnitName, detail: 'full' | 'lean'): Promise<CounterBill> {
    if (this.waiting.length >= this.limits.queue) {
      return Promise.reject(new AppError(503, 'compute_busy', 'Lumenyard is working through many takeoffs at once; try again in a moment.'))
    }
    return new Promise((resolve, reject) => {
      this.waiting.push({ job: { id: this.nextId++, takeoff, catalog, unit, detail }, resolve, reject })
      this.pump()
    })
  }

  /** Stops the worker (tests, shutdown); waiting computations are refused. */
  async stop(): Promise<void> {
    const worker = this.worker
    this.worker = null
    for (const p of this.waiting.splice(0)) p.reject(new AppError(503, 'compute_stopped', 'The server is stopping.'))
    if (worker) await worker.terminate()
  }

  private start(): Worker {
    const worker = new Worker(bootSource, { eval: true, resourceLimits: { maxOldGenerationSizeMb: this.limits.heapMb } })
    // The worker never keeps the process alive by itself.
    worker.unref()
    this.ready = false
    worker.on('message', (reply: ComputeReply | { ready: true }) => {
      if ('ready' in reply) {
        this.ready = true
        this.send()
      } else this.finish(reply)
    })
    // A worker that fails or exits on its own (out of memory) takes only its current computation with it;
    // one already replaced (timed out, stopped) is ignored.
    const lost = (message: string) => {
      if (this.worker !== worker) return
      this.worker = null
      this.fail(new AppError(500, 'compute_failed', message))
    }
    worker.on('error', (err) => lost(`The takeoff could not be computed: ${err.message}`))
    worker.on('exit', () => lost('The takeoff computation stopped unexpectedly.'))
    return worker
  }

  private pump(): void {
    if (this.running || this.waiting.length === 0) return
    this.running = this.waiting.shift() as Pending
    this.started++
    if (this.worker) return this.send()
    this.worker = this.start()
    this.timer = setTimeout(() => this.timeOut('start'), START_LIMIT_MS)
  }

  /** Hands the running computation to a loaded worker and starts its clock. */
  private send(): void {
    if (!this.running || !this.worker || !this.ready) return
    clearTimeout(this.timer)
    this.timer = setTimeout(() => this.timeOut('compute'), this.limits.timeMs)
    this.worker.postMessage(this.running.job)
  }

  private finish(reply: ComputeReply): void {
    const current = this.running
    if (!current || current.job.id !== reply.id) return
    clearTimeout(this.timer)
    this.running = null
    if (reply.ok) current.resolve(reply.bill)
    else current.reject(new AppError(500, 'compute_failed', `The takeoff could not be computed: ${reply.message}`))
    this.pump()
  }

  private fail(err: AppError): void {
    const current = this.running
    clearTimeout(this.timer)
    this.running = null
    current?.reject(err)
    this.pump()
  }

  private timeOut(phase: 'start' | 'compute'): void {
    const worker = this.worker
    this.worker = null
    const seconds = Math.round(this.limits.timeMs / 1000)
    this.fail(phase === 'start'
      ? new AppError(503, 'compute_unavailable', 'The takeoff computation could not start; try again in a moment.')
      : new AppError(503, 'compute_timeout', `The takeoff took more than ${seconds} s to compute and was stopped; split it into smaller takeoffs.`))
    void worker?.terminate()
  }
}

export const computeRunner = new ComputeRunner(COMPUTE_LIMITS)

/** The bill of a takeoff, computed off the main thread. */
export const computeOffThread = (takeoff: Takeoff, catalog: CounterCatalog, unit: LengthUnitName, detail: 'full' | 'lean') =>
  computeRunner.run(takeoff, catalog, unit, detail)

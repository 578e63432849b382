// The compute worker: runs the shared takeoff computation off the server's main thread, one request at
// a time, so a large takeoff never holds up other requests (computeRunner.ts starts it and caps its time).
import { parentPort } from 'node:worker_threads'
import { computeCounterBill } from '../../../shared/counter/counterBill.js'
import type { ComputeJob, ComputeReply } from './computeRunner.js'

parentPort?.on('message', (job: ComputeJob) => {
  let reply: ComputeReply
  try {
    reply = { id: job.id, ok: true, bill: computeCounterBill(job.takeoff, job.catalog, job.unit, job.detail) }
  } catch (err) {
    reply = { id: job.id, ok: false, message: err instanceof Error ? err.message : String(err) }
  }
  parentPort?.postMessage(reply)
})

// Loaded: the runner starts its clock from here, so a slow start never counts against a computation.
parentPort?.postMessage({ ready: true })

// The demo scenario: an invented supplier, its people, stock and a year of history.
// Loaded by `npm start` and `npm test` when the database is empty; every step is idempotent.
import type { DataSource, EntityManager } from 'typeorm'
import { User } from '../entities/User.js'
import { loadDemoUsers } from './demoUsers.js'

export interface DemoStep {
  name: string
  run(em: EntityManager, ds: DataSource): Promise<void>
}

/** Steps in order; later features append theirs. */
export const demoSteps: DemoStep[] = [{ name: 'users', run: (em) => loadDemoUsers(em) }]

export async function isDatabaseEmpty(ds: DataSource): Promise<boolean> {
  return (await ds.getRepository(User).count()) === 0
}

export async function loadDemoScenario(ds: DataSource, log: (msg: string) => void = () => {}): Promise<void> {
  for (const step of demoSteps) {
    const started = Date.now()
    await ds.transaction((em) => step.run(em, ds))
    log(`demo: ${step.name} (${Date.now() - started} ms)`)
  }
}

// The demo scenario: an invented supplier, its people, stock and a year of history.
// Loaded by `npm start` and `npm test` when the database is empty; every step is idempotent.
import type { DataSource, EntityManager } from 'typeorm'
import { User } from '../entities/User.js'
import { loadDemoCatalog } from './demoCatalog.js'
import { loadDemoCounter } from './demoCounter.js'
import { loadDemoCounterSales } from './demoCounterSales.js'
import { loadDemoPurchasing } from './demoPurchasing.js'
import { loadDemoSellingPrices } from './demoSellingPrices.js'
import { loadDemoStock } from './demoStock.js'
import { loadDemoUsers } from './demoUsers.js'
import { loadDemoWarehouses } from './demoWarehouses.js'

export interface DemoStep {
  name: string
  run(em: EntityManager, ds: DataSource): Promise<void>
}

/** Steps in order; later features append theirs. */
export const demoSteps: DemoStep[] = [
  { name: 'users', run: (em) => loadDemoUsers(em) },
  { name: 'catalog', run: (em) => loadDemoCatalog(em) },
  { name: 'warehouses', run: (em) => loadDemoWarehouses(em) },
  { name: 'stock history', run: (em) => loadDemoStock(em) },
  { name: 'counter', run: (em) => loadDemoCounter(em) },
  { name: 'purchasing', run: (em) => loadDemoPurchasing(em) },
  { name: 'selling prices', run: (em, ds) => loadDemoSellingPrices(em, ds) },
  { name: 'counter sales', run: (em, ds) => loadDemoCounterSales(em, ds) },
]

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

// Every migration in order. A new migration file is added to this list (timestamped class name).
import { Foundation1764633600000 } from './1764633600000-Foundation.js'
import { StockCore1764700000000 } from './1764700000000-StockCore.js'
import { CounterPurchasing1764730000000 } from './1764730000000-CounterPurchasing.js'

export const allMigrations = [Foundation1764633600000, StockCore1764700000000, CounterPurchasing1764730000000]

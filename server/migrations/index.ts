// Every migration in order. A new migration file is added to this list (timestamped class name).
import { Foundation1764633600000 } from './1764633600000-Foundation.js'
import { StockCore1764700000000 } from './1764700000000-StockCore.js'
import { CounterPurchasing1764730000000 } from './1764730000000-CounterPurchasing.js'
import { ReorderPolicies1764740000000 } from './1764740000000-ReorderPolicies.js'
import { Picking1764750000000 } from './1764750000000-Picking.js'
import { Purchasing1764760000000 } from './1764760000000-Purchasing.js'
import { CounterTakeoffSettings1764770000000 } from './1764770000000-CounterTakeoffSettings.js'
import { CycleCounts1796396073322 } from './1796396073322-CycleCounts.js'
import { CountEntryPoint1796397796030 } from './1796397796030-CountEntryPoint.js'
import { BuyingTrust1796403775001 } from './1796403775001-BuyingTrust.js'

export const allMigrations = [Foundation1764633600000, StockCore1764700000000, CounterPurchasing1764730000000, ReorderPolicies1764740000000, Picking1764750000000, Purchasing1764760000000, CounterTakeoffSettings1764770000000, CycleCounts1796396073322, CountEntryPoint1796397796030, BuyingTrust1796403775001]

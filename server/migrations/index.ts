import { Foundation1764633600000 } from './1764633600000-Foundation.js'
import { StockCore1764700000000 } from './1764700000000-StockCore.js'
import { CounterPurchasing1764730000000 } from './1764730000000-CounterPurchasing.js'
import { ReorderPolicies1764740000000 } from './1764740000000-ReorderPolicies.js'
import { Picking1764750000000 } from './1764750000000-Picking.js'
import { Purchasing1764760000000 } from './1764760000000-Purchasing.js'
import { CounterTakeoffSettings1764770000000 } from './1764770000000-CounterTakeoffSettings.js'
import { CycleCounts1796396073322 } from './1796396073322-CycleCounts.js'
import { BalanceLockOrder1796396073950 } from './1796396073950-BalanceLockOrder.js'
import { CountEntryPoint1796397796030 } from './1796397796030-CountEntryPoint.js'
import { SignInThrottle1796398811045 } from './1796398811045-SignInThrottle.js'
import { WeightUnit1796404704802 } from './1796404704802-WeightUnit.js'

export const allMigrations = [Foundation1764633600000, StockCore1764700000000, CounterPurchasing1764730000000, ReorderPolicies1764740000000, Picking1764750000000, Purchasing1764760000000, CounterTakeoffSettings1764770000000, CycleCounts1796396073322, BalanceLockOrder1796396073950, CountEntryPoint1796397796030, SignInThrottle1796398811045, WeightUnit1796404704802]

// Inventory mathematics shared by server and client: one import point.
export * from './abc.js'
export * from './allocation.js'
export * from './demand.js'
export * from './movingAverage.js'
export * from './packs.js'
export * from './reorder.js'
export * from './walkOrder.js'

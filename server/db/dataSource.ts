import 'reflect-metadata'
import mysql from 'mysql2'
import mysqlPromise from 'mysql2/promise'
import { DataSource } from 'typeorm'
import type { AppConfig } from '../config.js'
import { allEntities } from '../entities/index.js'
import { allMigrations } from '../migrations/index.js'

// TypeORM asks each pooled connection for its promise wrapper before every statement, and mysql2's
// PoolConnection.promise() require()s the wrapper's module each time. Under the tsx loader the app runs with
// (npm start), every such require goes through the loader's path resolution again: about a twentieth of the
// CPU a stock issue spent in Node (profiled with npm run bench -- --only=issue --cpu-prof). The same wrapper,
// with the class taken once from mysql2's own promise entry point:
type PromiseWrapped = new (connection: unknown, promiseImpl?: PromiseConstructor) => unknown
const PromisePoolConnection = (mysqlPromise as unknown as { PoolConnection: PromiseWrapped }).PoolConnection
;(mysql as unknown as { PoolConnection: { prototype: { promise(impl?: PromiseConstructor): unknown } } }).PoolConnection.prototype.promise = function (
  this: unknown,
  promiseImpl?: PromiseConstructor,
) {
  return new PromisePoolConnection(this, promiseImpl)
}

export function createDataSource(config: Pick<AppConfig, 'db'>): DataSource {
  return new DataSource({
    type: 'mysql',
    host: config.db.host,
    port: config.db.port,
    username: config.db.user,
    password: config.db.password,
    database: config.db.database,
    charset: 'utf8mb4_unicode_ci',
    timezone: 'Z',
    entities: allEntities,
    migrations: allMigrations,
    migrationsTableName: 'schema_migrations',
    synchronize: false,
    logging: ['error'],
    poolSize: config.db.pool,
    // trace: false — mysql2's promise layer otherwise captures a stack trace (Error.captureStackTrace) before every
    // statement, to graft onto an error that almost never comes: about a twentieth of a signed-in scan lookup's CPU
    // (npm run bench -- --only=scan --cpu-prof). A failed statement's error keeps its code, message and SQL.
    extra: { decimalNumbers: false, supportBigNumbers: true, bigNumberStrings: true, trace: false },
  })
}

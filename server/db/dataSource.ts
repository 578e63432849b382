import 'reflect-metadata'
import { DataSource } from 'typeorm'
import type { AppConfig } from '../config.js'
import { allEntities } from '../entities/index.js'
import { allMigrations } from '../migrations/index.js'

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
    extra: { decimalNumbers: false, supportBigNumbers: true, bigNumberStrings: true },
  })
}

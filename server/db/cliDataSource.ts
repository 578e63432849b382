// The one DataSource the TypeORM CLI loads (migration:generate, migration:run).
import { loadConfig } from '../config.js'
import { createDataSource } from './dataSource.js'

export const dataSource = createDataSource(loadConfig())

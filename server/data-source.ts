// Entry point for the TypeORM CLI (`npm run migration:generate -- server/migrations/Name`); the app builds its own.
import { loadConfig } from './config/config'
import { createDataSource } from './db/data-source'

export default createDataSource(loadConfig().DATABASE_URL)

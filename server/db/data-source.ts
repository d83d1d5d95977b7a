import 'reflect-metadata'
import { DataSource } from 'typeorm'
import { entities, migrations } from './schema'
import { SnakeNamingStrategy } from './snake-naming.strategy'

/** One DataSource per process (or per test database); schema changes only ever come from migrations. */
export function createDataSource(url: string, options: { logging?: boolean } = {}): DataSource {
  return new DataSource({
    type: 'postgres',
    url,
    entities,
    migrations,
    namingStrategy: new SnakeNamingStrategy(),
    synchronize: false,
    migrationsRun: false,
    logging: options.logging ?? false,
    extra: { max: 10, connectionTimeoutMillis: 5_000 },
  })
}

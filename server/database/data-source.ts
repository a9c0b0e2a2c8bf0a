import 'reflect-metadata';

import { DataSource, type Logger as TypeOrmLogger } from 'typeorm';
import type { Logger } from 'pino';

import { migrations } from './migrations';
import { entities } from './entities';

export interface DataSourceOptions {
  readonly url: string;
  readonly logger?: Logger;
  /** Pool size per app instance; several stateless instances share one PostgreSQL. */
  readonly poolSize?: number;
  /** Shown in pg_stat_activity, so an operator can tell whose connections these are. */
  readonly applicationName?: string;
}

/** The one TypeORM DataSource: explicit entities and migrations, never `synchronize`. */
export function createDataSource({ url, logger, poolSize = 10, applicationName = 'flowlore' }: DataSourceOptions): DataSource {
  return new DataSource({
    type: 'postgres',
    url,
    entities,
    migrations,
    migrationsTableName: 'schema_migration',
    migrationsTransactionMode: 'each',
    synchronize: false,
    // Ids default to gen_random_uuid() (built into PostgreSQL 13+); no extension is needed or installed.
    uuidExtension: 'pgcrypto',
    installExtensions: false,
    logger: logger ? new PinoTypeOrmLogger(logger) : undefined,
    logging: ['error', 'warn', 'migration'],
    // Fail fast while the database is away so health checks answer quickly instead of hanging.
    extra: { max: poolSize, application_name: applicationName, connectionTimeoutMillis: 3000, idleTimeoutMillis: 30000 },
  });
}

class PinoTypeOrmLogger implements TypeOrmLogger {
  constructor(private readonly logger: Logger) {}
  logQuery(): void {}
  logQueryError(error: string | Error, query: string): void {
    this.logger.error({ err: error, query }, 'query failed');
  }
  logQuerySlow(time: number, query: string): void {
    this.logger.warn({ time, query }, 'slow query');
  }
  logSchemaBuild(message: string): void {
    this.logger.debug(message);
  }
  logMigration(message: string): void {
    this.logger.info(message);
  }
  log(level: 'log' | 'info' | 'warn', message: unknown): void {
    this.logger[level === 'log' ? 'info' : level]({ detail: message }, 'database');
  }
}

import { loadConfig } from './config';
import { createDataSource } from './database/data-source';
import { runSeeds } from './database/seeds';
import { createLogger } from './logger';

/** Database chores run before the server starts: `migrate`, `revert`, `seed`. */
async function cli(command: string | undefined): Promise<void> {
  const config = loadConfig();
  const logger = createLogger(config.logLevel);
  const dataSource = createDataSource({ url: config.databaseUrl, logger, poolSize: 2 });
  await dataSource.initialize();
  try {
    switch (command) {
      case 'migrate': {
        const ran = await dataSource.runMigrations({ transaction: 'each' });
        process.stdout.write(`[flowlore] migrations applied: ${ran.length ? ran.map((m) => m.name).join(', ') : 'none (up to date)'}\n`);
        break;
      }
      case 'revert':
        await dataSource.undoLastMigration({ transaction: 'each' });
        break;
      case 'seed': {
        const applied = await runSeeds(dataSource);
        process.stdout.write(`[flowlore] demo seed sets applied: ${applied.length ? applied.join(', ') : 'none (already seeded)'}\n`);
        break;
      }
      default:
        throw new Error('usage: cli.js migrate|revert|seed');
    }
  } finally {
    await dataSource.destroy();
  }
}

cli(process.argv[2]).catch((err: unknown) => {
  process.stderr.write(`${err instanceof Error ? err.message : String(err)}\n`);
  process.exit(1);
});

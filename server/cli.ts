import { parseArgs } from 'node:util';

import { ROLES, type CreateUserRequest, type Role } from '../shared/api/accounts';
import { createVerifiedUser } from './accounts/create-user';
import { PasswordHasher } from './auth/passwords';
import { loadConfig } from './config';
import { createDataSource } from './database/data-source';
import { runSeeds } from './database/seeds';
import { createLogger } from './logger';

const USAGE = `usage: cli.js migrate|revert|seed
       cli.js create-user --email E --name "Display Name" --role ${ROLES.join('|')} [--shop "Shop name"]
         (the password comes from FLOWLORE_NEW_USER_PASSWORD, or is asked for when run in a terminal)`;

/** Database chores run before the server starts (`migrate`, `revert`, `seed`) and `create-user`. */
async function cli(argv: readonly string[]): Promise<void> {
  const [command, ...rest] = argv;
  // Parse and read the password before connecting, so a typo costs no connection.
  const newUser = command === 'create-user' ? await createUserArguments(rest) : undefined;
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
      case 'create-user': {
        const user = await createVerifiedUser({ dataSource, hasher: new PasswordHasher(config.passwordHashCost) }, newUser as CreateUserRequest);
        // The id alone on stdout, so a script can capture it; the sentence for people on stderr.
        process.stderr.write(`[flowlore] created ${user.role} ${user.email} (verified); id:\n`);
        process.stdout.write(`${user.id}\n`);
        break;
      }
      default:
        throw new Error(USAGE);
    }
  } finally {
    await dataSource.destroy();
  }
}

/** `create-user`'s options; never a password from argv, which any local user can read in `ps`. */
async function createUserArguments(args: readonly string[]): Promise<CreateUserRequest> {
  let values: { email?: string; name?: string; role?: string; shop?: string };
  try {
    ({ values } = parseArgs({
      args: [...args],
      options: { email: { type: 'string' }, name: { type: 'string' }, role: { type: 'string' }, shop: { type: 'string' } },
      strict: true,
      allowPositionals: false,
    }));
  } catch (error) {
    throw new Error(`${error instanceof Error ? error.message : String(error)}\n${USAGE}`);
  }
  if (!values.email || !values.name || !values.role) throw new Error(`create-user needs --email, --name and --role.\n${USAGE}`);
  if (!(ROLES as readonly string[]).includes(values.role)) throw new Error(`--role must be one of ${ROLES.join(', ')}.`);
  const password = await newUserPassword(values.email);
  return { email: values.email, displayName: values.name, role: values.role as Role, shopName: values.shop, password };
}

async function newUserPassword(email: string): Promise<string> {
  const fromEnv = process.env['FLOWLORE_NEW_USER_PASSWORD'];
  if (fromEnv) return fromEnv;
  if (!process.stdin.isTTY) throw new Error('Set FLOWLORE_NEW_USER_PASSWORD, or run create-user in a terminal to be asked for the password.');
  const first = await askHidden(`Password for ${email}: `);
  const second = await askHidden('The same password again: ');
  if (first !== second) throw new Error('The two passwords differ; nothing was created.');
  return first;
}

/** Reads one line from the terminal without echoing it (raw mode: Enter ends, Backspace deletes, Ctrl-C aborts). */
function askHidden(question: string): Promise<string> {
  return new Promise((resolve, reject) => {
    const stdin = process.stdin;
    let typed = '';
    const finish = (done: () => void) => {
      stdin.setRawMode(false);
      stdin.pause();
      stdin.off('data', onData);
      process.stderr.write('\n');
      done();
    };
    const onData = (chunk: string) => {
      for (const char of chunk) {
        if (char === '\r' || char === '\n') return finish(() => resolve(typed));
        if (char === '\u0003' || char === '\u0004') return finish(() => reject(new Error('Cancelled; nothing was created.')));
        if (char === '\u007f' || char === '\b') typed = [...typed].slice(0, -1).join('');
        else if (char >= ' ') typed += char;
      }
    };
    process.stderr.write(question);
    stdin.setEncoding('utf8');
    stdin.setRawMode(true);
    stdin.resume();
    stdin.on('data', onData);
  });
}

cli(process.argv.slice(2)).catch((err: unknown) => {
  process.stderr.write(`${err instanceof Error ? err.message : String(err)}\n`);
  process.exit(1);
});

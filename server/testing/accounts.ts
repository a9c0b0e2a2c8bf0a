import { randomUUID } from 'node:crypto';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

import type { Express } from 'express';
import { Client } from 'pg';
import type { Logger } from 'pino';
import request from 'supertest';
import type { DataSource } from 'typeorm';

import type { Role } from '../../shared/api/accounts';
import { User } from '../accounts/user.entity';
import { createApp } from '../app';
import { PasswordHasher } from '../auth/passwords';
import { DEFAULT_RATE_LIMITS, type AuthRateLimits } from '../auth/rate-limits';
import type { Config } from '../config';
import { LessonStore } from '../lessons/lesson-store';
import { Mailer, smtpTransport } from '../mail/mailer';
import { Shop } from '../shops/shop.entity';
import { silentLogger, testConfig, testDatabaseUrl, testDataSource } from './database';

/** Bcrypt cost for tests that are not about hashing (config allows < 12 only when NODE_ENV=test). */
export const FAST_HASH_COST = 4;
export const TEST_PASSWORD = 'bench-test-passphrase-9';

/** The test database, migrated (under an advisory lock, as several jest workers start at once). */
export async function migratedTestDataSource(): Promise<DataSource> {
  const lock = new Client({ connectionString: testDatabaseUrl() });
  await lock.connect();
  try {
    await lock.query(`SELECT pg_advisory_lock(hashtext('flowlore-test-migrations'))`);
    const dataSource = testDataSource();
    await dataSource.initialize();
    await dataSource.runMigrations({ transaction: 'each' });
    return dataSource;
  } finally {
    await lock.end();
  }
}

export interface AccountsTestApp {
  readonly app: Express;
  readonly config: Config;
  readonly mailer: Mailer;
}

/** The whole app with fast hashing, its own rate-limit counters (generous unless given) and no lessons. */
export function accountsTestApp(
  dataSource: DataSource,
  options: { rateLimits?: Partial<AuthRateLimits>; now?: () => Date; logger?: Logger; config?: Partial<Config> } = {},
): AccountsTestApp {
  const config = testConfig({ passwordHashCost: FAST_HASH_COST, clientDir: join(tmpdir(), 'flowlore-no-client'), ...options.config });
  const logger = options.logger ?? silentLogger;
  const mailer = new Mailer(smtpTransport(config.mail), config.mail.from, dataSource, logger);
  const generous = { limit: 1_000_000, windowMs: 60_000 };
  const rateLimits: AuthRateLimits = {
    ...DEFAULT_RATE_LIMITS,
    signIn: generous,
    signUp: generous,
    passwordReset: generous,
    ...options.rateLimits,
    keyPrefix: `test-${randomUUID()}:`,
  };
  const lessons = new LessonStore(mkdtempSync(join(tmpdir(), 'flowlore-no-lessons-')), logger);
  const app = createApp({ config, dataSource, logger, lessons, mailer, rateLimits, now: options.now });
  return { app, config, mailer };
}

export function uniqueEmail(label: string): string {
  return `${label}-${randomUUID().slice(0, 12)}@test.flowlore.test`;
}

const fastHasher = new PasswordHasher(FAST_HASH_COST);

/** A user written straight to the database (verified unless told otherwise). */
export async function createUser(
  dataSource: DataSource,
  options: { role?: Role; email?: string; password?: string; verified?: boolean; shopId?: string | null; displayName?: string } = {},
): Promise<User> {
  const role = options.role ?? 'apprentice';
  const repo = dataSource.getRepository(User);
  return repo.save(
    repo.create({
      email: options.email ?? uniqueEmail(role),
      displayName: options.displayName ?? `Test ${role}`,
      passwordHash: await fastHasher.hash(options.password ?? TEST_PASSWORD),
      role,
      shopId: options.shopId ?? null,
      verifiedAt: options.verified === false ? null : new Date(),
      disabledAt: null,
    }),
  );
}

/** A shop owner with a shop of their own. */
export async function createShopOwner(dataSource: DataSource, shopName = 'Test Flow Shop'): Promise<{ owner: User; shop: Shop }> {
  const owner = await createUser(dataSource, { role: 'shop_owner' });
  const shop = await dataSource.getRepository(Shop).save({ name: shopName, ownerId: owner.id });
  await dataSource.getRepository(User).update({ id: owner.id }, { shopId: shop.id });
  owner.shopId = shop.id;
  return { owner, shop };
}

/** The XSRF-TOKEN value a response set, if any. */
export function xsrfCookie(res: request.Response): string | undefined {
  const cookies = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
  const found = cookies.find((c) => c.startsWith('XSRF-TOKEN='));
  return found ? decodeURIComponent(found.split(';')[0]!.slice('XSRF-TOKEN='.length)) : undefined;
}

/** The session id cookie value a response set, if any. */
export function sessionCookie(res: request.Response): string | undefined {
  const cookies = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
  const found = cookies.find((c) => c.startsWith('flowlore.sid='));
  return found ? decodeURIComponent(found.split(';')[0]!.slice('flowlore.sid='.length)) : undefined;
}

/** The session row id behind a signed cookie value `s:<sid>.<signature>`. */
export function sidOf(cookieValue: string): string {
  return cookieValue.replace(/^s:/, '').replace(/\.[^.]*$/, '');
}

/** A browser-like client: a cookie jar plus the current CSRF token, sent on every mutating request. */
export class Browser {
  readonly agent: ReturnType<typeof request.agent>;
  csrf = '';

  constructor(app: Express) {
    this.agent = request.agent(app);
  }

  async fetchCsrf(): Promise<string> {
    const res = await this.agent.get('/api/auth/csrf');
    this.csrf = res.body.token;
    return this.csrf;
  }

  private remember(res: request.Response): request.Response {
    this.csrf = xsrfCookie(res) ?? this.csrf;
    return res;
  }

  get(path: string) {
    return this.agent.get(path);
  }

  async send(method: 'post' | 'patch' | 'delete' | 'put', path: string, body?: object): Promise<request.Response> {
    if (!this.csrf) await this.fetchCsrf();
    const req = this.agent[method](path).set('X-XSRF-TOKEN', this.csrf);
    return this.remember(await (body === undefined ? req : req.send(body)));
  }

  async signIn(email: string, password = TEST_PASSWORD): Promise<request.Response> {
    return this.send('post', '/api/auth/sign-in', { email, password });
  }
}

export async function signedIn(app: Express, user: Pick<User, 'email'>, password = TEST_PASSWORD): Promise<Browser> {
  const browser = new Browser(app);
  const res = await browser.signIn(user.email, password);
  if (res.status !== 200) throw new Error(`sign-in of ${user.email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return browser;
}

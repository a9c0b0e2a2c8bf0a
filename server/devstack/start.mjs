// `npm start`: installs what is missing, starts PostgreSQL (unless DATABASE_URL points elsewhere),
// migrates, seeds the demo scenario, builds the app and serves it; Ctrl-C stops it all cleanly.
import { spawn } from 'node:child_process';

import { startMailCatcher } from './mail-catcher.mjs';
import { startProviderFake } from './provider-fake.mjs';
import { log, run } from './process.mjs';
import { ensureNpmDependencies } from './npm-deps.mjs';
import { loadDotEnv, root } from './paths.mjs';

async function start() {
  loadDotEnv();
  await ensureNpmDependencies(root);

  let stopDatabase = async () => {};
  let databaseUrl = process.env.DATABASE_URL;
  if (databaseUrl) {
    log('DATABASE_URL is set: using that server, starting none');
  } else {
    const { openLocalDatabase } = await import('./local-database.mjs');
    const db = await openLocalDatabase('flowlore');
    databaseUrl = db.url;
    stopDatabase = db.stop;
  }
  // Mail goes to the local catcher unless SMTP_HOST points at a real server.
  let stopMail = async () => {};
  const mailEnv = {};
  if (!process.env.SMTP_HOST) {
    const catcher = await startMailCatcher({
      smtpPort: Number(process.env.MAILDEV_SMTP_PORT ?? 1025),
      webPort: Number(process.env.MAILDEV_WEB_PORT ?? 1080),
    }).catch(async (error) => {
      await stopDatabase();
      throw error;
    });
    stopMail = catcher.stop;
    Object.assign(mailEnv, { SMTP_HOST: catcher.smtpHost, SMTP_PORT: String(catcher.smtpPort), SMTP_SECURE: 'false', MAILDEV_API_URL: catcher.apiUrl });
  }
  const env = {
    ...process.env,
    ...mailEnv,
    DATABASE_URL: databaseUrl,
    NODE_ENV: process.env.NODE_ENV ?? 'development',
    // `npm start` is the demo: the sign-in page lists the demo accounts.
    DEMO_MODE: process.env.DEMO_MODE ?? 'true',
  };

  let server;
  let stopProvider = async () => {};
  let interrupted = false;
  const onSignal = (signal) => {
    interrupted = true;
    if (server) server.kill('SIGTERM');
    else log(`${signal}: stopping after the current step`);
  };
  process.on('SIGINT', onSignal);
  process.on('SIGTERM', onSignal);

  try {
    log('building the app');
    await run('npm', ['run', '--silent', 'build'], { cwd: root, env });
    await run('node', ['dist/api/server/cli.js', 'migrate'], { cwd: root, env });
    await run('node', ['dist/api/server/cli.js', 'seed'], { cwd: root, env });
    if (interrupted) return 0;
    // Payments: the provider's local fake, unless keys for the provider itself are set.
    if (!process.env.STRIPE_SECRET_KEY) {
      const provider = await startProviderFake({ port: Number(process.env.PROVIDER_FAKE_PORT ?? 12111), webhookUrl: `http://127.0.0.1:${process.env.PORT ?? 4300}/api/payments/webhook` });
      stopProvider = provider.stop;
      Object.assign(env, { STRIPE_SECRET_KEY: provider.secretKey, STRIPE_WEBHOOK_SECRET: provider.webhookSecret, PAYMENT_PROVIDER_URL: provider.url });
    }
    server = spawn('node', ['dist/api/server/main.js'], { cwd: root, env, stdio: 'inherit' });
    return await new Promise((resolve) => server.on('exit', (code, signal) => resolve(code ?? (signal ? 0 : 1))));
  } finally {
    await stopProvider();
    await stopMail();
    await stopDatabase();
  }
}

start().then(
  (code) => process.exit(code),
  (error) => {
    process.stderr.write(`[flowlore] npm start failed: ${error.message}\n`);
    process.exit(1);
  },
);

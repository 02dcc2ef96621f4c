// Starts both local fakes for development and e2e runs: `npx tsx fakes/run.ts`.
// Defaults match what the app reads from env (its defaults: README.md, "Configuration"); every value can be overridden.
import { startMailFake } from './mail/server';
import { startStripeFake } from './stripe/server';

function port(name: string, fallback: number): number {
  const raw = process.env[name];
  const value = raw === undefined || raw === '' ? fallback : Number(raw);
  if (!Number.isInteger(value) || value < 0 || value > 65_535)
    throw new Error(`${name} must be a port number, got "${raw}"`);
  return value;
}

async function main(): Promise<void> {
  const stripe = await startStripeFake({
    port: port('FAKE_STRIPE_PORT', 12111),
    webhookUrl: process.env.STRIPE_WEBHOOK_URL || 'http://127.0.0.1:3100/api/stripe/webhook',
    webhookSecret: process.env.STRIPE_WEBHOOK_SECRET || 'whsec_combtrace_local',
    publicUrl: process.env.FAKE_STRIPE_PUBLIC_URL || undefined,
  });
  const mail = await startMailFake({
    smtpPort: port('FAKE_SMTP_PORT', 1025),
    webPort: port('FAKE_MAIL_WEB_PORT', 1080),
  }).catch(async (err: unknown) => {
    await stripe.close();
    throw err;
  });
  console.log(`stripe fake: ${stripe.url} (API /v1, dashboard /, test hooks /_fake)`);
  console.log(`mail fake: smtp://127.0.0.1:${mail.smtpPort} inbox ${mail.webUrl}`);

  let stopping = false;
  const stop = (signal: NodeJS.Signals) => {
    if (stopping) return;
    stopping = true;
    Promise.all([stripe.close(), mail.close()]).then(
      () => {
        console.log(`fakes stopped (${signal})`);
        process.exit(0);
      },
      (err: unknown) => {
        console.error('fakes: error while stopping', err);
        process.exit(1);
      },
    );
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
}

main().catch((err: unknown) => {
  console.error('fakes: could not start', err);
  process.exit(1);
});

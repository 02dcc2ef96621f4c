/** Runs once per server process: a timer that sends queued mail the request path did not get to. */
export async function register() {
  if (process.env.NEXT_RUNTIME !== 'nodejs' || process.env.MAIL_TIMER === 'off') return;
  const { deliverDueMail } = await import('@/lib/mail/outbox');
  const everyMs = Number(process.env.MAIL_TIMER_MS ?? 5_000);
  const timer = setInterval(() => {
    deliverDueMail().catch((err) => console.error('[mail] timer:', err instanceof Error ? err.message : err));
  }, everyMs);
  timer.unref();
}

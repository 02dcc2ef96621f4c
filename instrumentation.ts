/** Runs once per server process: timers for account requests, queued mail and for unpaid orders whose reservation ran out. */
export async function register() {
  if (process.env.NEXT_RUNTIME !== 'nodejs' || process.env.MAIL_TIMER === 'off') return;
  const { deliverDueMail } = await import('@/lib/mail/outbox');
  const everyMs = Number(process.env.MAIL_TIMER_MS ?? 5_000);
  // Password-reset and sign-up requests are answered first and worked through here or right after.
  const { processAccountRequests } = await import('@/lib/data/auth/account-requests');
  const timer = setInterval(() => {
    processAccountRequests()
      .catch((err) => console.error('[auth] account requests:', err instanceof Error ? err.message : err))
      .then(() => deliverDueMail())
      .catch((err) => console.error('[mail] timer:', err instanceof Error ? err.message : err));
  }, everyMs);
  timer.unref();
  // Expired Checkout Sessions also release through the webhook; this catches a missed one.
  const { releaseOverdueReservations } = await import('@/lib/data/shop/checkout');
  const sweep = setInterval(() => {
    releaseOverdueReservations().catch((err) =>
      console.error('[orders] sweep:', err instanceof Error ? err.message : err),
    );
  }, 60_000);
  sweep.unref();
}

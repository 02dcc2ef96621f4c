/** Where the app runs when neither APP_URL nor NEXTAUTH_URL is set (`npm run dev`, `npm run up`). */
const LOCAL_APP_URL = 'http://127.0.0.1:3100';

/**
 * The app's public base URL, without a trailing slash, for every link we send out: e-mails,
 * Stripe redirects, label QR codes and our own redirects. APP_URL, else NEXTAUTH_URL, else the
 * local default; an empty variable counts as unset. Never the request's Host: behind a proxy that
 * is the internal address.
 */
export function appUrl(env: Record<string, string | undefined> = process.env): string {
  return (env.APP_URL || env.NEXTAUTH_URL || LOCAL_APP_URL).replace(/\/+$/, '');
}

import '@fontsource/lora/400.css';
import '@fontsource/lora/600.css';
import '@fontsource/lora/700.css';
import '@fontsource/inter/400.css';
import '@fontsource/inter/600.css';
import './globals.css';
import type { Metadata, Viewport } from 'next';
import { headers } from 'next/headers';

export const metadata: Metadata = {
  title: { default: 'Combtrace', template: '%s · Combtrace' },
  description: 'Honey from the colony to the customer.',
  // Drawn by lib/ops/icons.ts (npm run icons); the manifest names the app icons.
  manifest: '/manifest.webmanifest',
  icons: {
    icon: [
      { url: '/favicon.ico', sizes: '16x16 32x32 48x48' },
      { url: '/icons/icon.svg', type: 'image/svg+xml' },
    ],
    apple: [{ url: '/icons/apple-touch-icon.png', sizes: '180x180' }],
  },
};

export const viewport: Viewport = { width: 'device-width', initialScale: 1, themeColor: '#1b3a2a' };

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  // Reading the request makes every page render per request, so each gets its own CSP nonce.
  await headers();
  return (
    <html lang="en">
      <body className="min-h-screen bg-paper text-ink">
        <a
          href="#main"
          className="sr-only focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:z-50 focus:rounded focus:bg-white focus:px-3 focus:py-2"
        >
          Skip to content
        </a>
        {children}
      </body>
    </html>
  );
}

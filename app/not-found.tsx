import Link from 'next/link';

export default function NotFound() {
  return (
    <main id="main" className="mx-auto max-w-lg px-4 py-16 text-center">
      <p className="text-sm font-semibold tracking-wide text-ink-soft uppercase">404</p>
      <h1 className="mt-2">We could not find that page</h1>
      <p className="mt-3 text-ink-soft">The link may be old, or the record may not be yours to see.</p>
      <p className="mt-6">
        <Link className="btn-secondary no-underline" href="/">
          Back to the shop
        </Link>
      </p>
    </main>
  );
}

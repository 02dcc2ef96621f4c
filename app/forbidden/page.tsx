import Link from 'next/link';

export const metadata = { title: 'Not allowed' };

export default function ForbiddenPage() {
  return (
    <main id="main" className="mx-auto max-w-lg px-4 py-16 text-center">
      <p className="text-sm font-semibold tracking-wide text-ink-soft uppercase">403</p>
      <h1 className="mt-2">This part is not open to your account</h1>
      <p className="mt-3 text-ink-soft">If you think you should have access, ask the owner of the business.</p>
      <p className="mt-6 flex justify-center gap-3">
        <Link className="btn-secondary no-underline" href="/">
          Go to the shop
        </Link>
        <Link className="btn-quiet" href="/welcome">
          My start page
        </Link>
      </p>
    </main>
  );
}

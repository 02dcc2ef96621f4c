'use client';

export default function GlobalError({ error }: { error: Error & { digest?: string } }) {
  return (
    <html lang="en">
      <body
        style={{
          fontFamily: 'system-ui',
          background: '#f8f5ee',
          color: '#1d2a22',
          padding: '4rem 1rem',
          textAlign: 'center',
        }}
      >
        <h1>Something went wrong</h1>
        <p>Please try again. Reference: {error.digest ?? 'unknown'}</p>
      </body>
    </html>
  );
}

export function FormMessage({ error, success }: { error?: string; success?: string }) {
  if (error) return <p role="alert" className="rounded-lg bg-bad-bg px-3 py-2 text-sm font-medium text-bad-fg">{error}</p>;
  if (success) return <p role="status" className="rounded-lg bg-ok-bg px-3 py-2 text-sm font-medium text-ok-fg">{success}</p>;
  return null;
}

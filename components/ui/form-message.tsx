/** What a form says about its last submit: a refusal (`error`) or a confirmation (`success`). */
export type FormMessageState = { error?: string; success?: string };

/** The one way forms show their message: an alert for a refusal, a status for a confirmation. */
export function FormMessage({ error, success }: FormMessageState) {
  if (error)
    return (
      <p role="alert" className="rounded-lg bg-bad-bg px-3 py-2 text-sm font-medium text-bad-fg">
        {error}
      </p>
    );
  if (success)
    return (
      <p role="status" className="rounded-lg bg-ok-bg px-3 py-2 text-sm font-medium text-ok-fg">
        {success}
      </p>
    );
  return null;
}

/** The waiting and failed states of a query, said the same way on every page (a status line, or the server's message as an alert). */
export function QueryStatus({ query, loading }: { query: { isPending: boolean; isError: boolean; error: unknown }; loading: string }) {
  if (query.isPending)
    return (
      <p role="status" className="text-sm text-graphite-soft">
        {loading}
      </p>
    );
  return (
    <p role="alert" className="text-sm text-severity-error">
      {(query.error as Error | null)?.message ?? "Something went wrong."}
    </p>
  );
}

/** What a form loaded on demand (next/dynamic) shows while its code arrives. */
export function FormLoading() {
  return (
    <p role="status" className="text-sm text-graphite-2">
      Loading the form…
    </p>
  );
}

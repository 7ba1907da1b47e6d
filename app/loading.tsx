export default function Loading() {
  return (
    <div className="animate-pulse space-y-4" aria-busy="true" aria-label="Loading">
      <div className="h-8 w-1/3 rounded bg-paper-2" />
      <div className="h-4 w-2/3 rounded bg-paper-2" />
      <div className="h-32 rounded bg-paper-2" />
    </div>
  );
}

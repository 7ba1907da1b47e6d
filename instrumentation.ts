// Runs once when a Scribeline server starts: begins sending the e-mail outbox.
export async function register() {
  if (process.env.NEXT_RUNTIME === 'nodejs' && process.env.NEXT_PHASE !== 'phase-production-build') {
    const { startMailWorker } = await import('./lib/server/mail-worker');
    startMailWorker();
  }
}

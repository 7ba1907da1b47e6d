// Runs once when a Scribeline server starts: notes each request's socket address, begins sending the e-mail outbox
// and the scheduled upload clean-up, and makes SIGTERM / Ctrl-C stop gracefully (lib/server/lifecycle.ts).
export async function register() {
  if (process.env.NEXT_RUNTIME === 'nodejs' && process.env.NEXT_PHASE !== 'phase-production-build') {
    // The socket's address on every request, for the sign-in limits (lib/http/peer-address.ts).
    const { stampPeerAddresses } = await import('./lib/http/peer-address');
    stampPeerAddresses();
    // Each request's reads follow its own writes when there are database replicas (db/read-routing.ts).
    const { scopeRequests } = await import('./db/read-routing');
    scopeRequests();
    const { startMailWorker } = await import('./lib/server/mail-worker');
    startMailWorker();
    const { startFileCleanup } = await import('./lib/server/file-cleanup');
    startFileCleanup();
    const { installGracefulStop } = await import('./lib/server/lifecycle');
    installGracefulStop();
  }
}

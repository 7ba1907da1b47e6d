import { createRouteHandler } from 'uploadthing/next';
import { ourFileRouter } from './core';

// Token, ingest/API URLs, callback URL and dev mode all come from the UPLOADTHING_* environment,
// so the same code talks to the local upload service or the hosted one.
export const { GET, POST } = createRouteHandler({ router: ourFileRouter });

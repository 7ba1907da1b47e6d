export type HeaderEnv = { NODE_ENV?: string; UPLOADTHING_INGEST_URL?: string; UPLOADS_FILE_ORIGINS?: string };
export function contentSecurityPolicy(env?: HeaderEnv): string;
export function securityHeaders(env?: HeaderEnv): { key: string; value: string }[];

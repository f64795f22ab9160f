// Settings of the upload fake. The server entry reads them from the environment only
// (scripts/env.sh); tests pass them directly to startUploadFake.

export interface UploadFakeOptions {
  /** 0 picks a free port. */
  port: number;
  /** Folder for stored files; created if missing. */
  dir: string;
  /** The HMAC secret (the token's apiKey, starts with `sk_`). */
  apiKey: string;
  appId: string;
  /** How long a PUT waits for its `/route-metadata` registration (it may arrive after the PUT). */
  registrationTimeoutMs?: number;
  /** How long a held PUT waits for `/callback-result`: longer than the slowest onUploadComplete. */
  callbackTimeoutMs?: number;
  /** How long a dev-mode JSON-lines stream stays open waiting for its files. */
  devStreamTimeoutMs?: number;
  /** Called with one line per notable event; silent when absent. */
  log?: (line: string) => void;
}

export type ResolvedOptions = Required<Omit<UploadFakeOptions, 'log'>> & Pick<UploadFakeOptions, 'log'>;

export const DEFAULT_TIMEOUTS = {
  registrationTimeoutMs: 30_000,
  callbackTimeoutMs: 15 * 60_000,
  devStreamTimeoutMs: 60 * 60_000,
} as const;

export interface UploadToken {
  apiKey: string;
  appId: string;
  regions: string[];
}

/** Decodes `UPLOADTHING_TOKEN` (base64 JSON) the way the SDK does, with a clear error. */
export function parseUploadToken(token: string): UploadToken {
  let parsed: unknown;
  try {
    parsed = JSON.parse(Buffer.from(token, 'base64').toString('utf8'));
  } catch {
    throw new Error('UPLOADTHING_TOKEN: not base64 of a JSON object');
  }
  const t = parsed as Partial<UploadToken>;
  if (typeof t.apiKey !== 'string' || !t.apiKey.startsWith('sk_')) {
    throw new Error('UPLOADTHING_TOKEN: apiKey must be a string starting with "sk_"');
  }
  if (typeof t.appId !== 'string' || t.appId === '') throw new Error('UPLOADTHING_TOKEN: appId missing');
  if (!Array.isArray(t.regions) || t.regions.length === 0) throw new Error('UPLOADTHING_TOKEN: regions must be a non-empty array');
  return { apiKey: t.apiKey, appId: t.appId, regions: t.regions };
}

/** Builds the same token the SDK expects; tests use it to configure the real SDK. */
export function makeUploadToken(apiKey: string, appId: string): string {
  return Buffer.from(JSON.stringify({ apiKey, appId, regions: ['local'] })).toString('base64');
}

function intFromEnv(env: NodeJS.ProcessEnv, name: string): number | undefined {
  const raw = env[name];
  if (raw === undefined || raw === '') return undefined;
  const n = Number(raw);
  if (!Number.isInteger(n) || n < 0) throw new Error(`${name}: expected a non-negative integer, got "${raw}"`);
  return n;
}

export function optionsFromEnv(env: NodeJS.ProcessEnv = process.env): UploadFakeOptions {
  const missing = ['FAKE_UPLOADS_PORT', 'FAKE_UPLOADS_DIR', 'UPLOADTHING_TOKEN'].filter((n) => !env[n]);
  if (missing.length > 0) throw new Error(`upload fake: missing ${missing.join(', ')} (source scripts/env.sh demo|test)`);
  const { apiKey, appId } = parseUploadToken(env.UPLOADTHING_TOKEN!);
  return {
    port: intFromEnv(env, 'FAKE_UPLOADS_PORT')!,
    dir: env.FAKE_UPLOADS_DIR!,
    apiKey,
    appId,
    registrationTimeoutMs: intFromEnv(env, 'FAKE_UPLOADS_REGISTRATION_TIMEOUT_MS'),
    callbackTimeoutMs: intFromEnv(env, 'FAKE_UPLOADS_CALLBACK_TIMEOUT_MS'),
    devStreamTimeoutMs: intFromEnv(env, 'FAKE_UPLOADS_DEV_STREAM_TIMEOUT_MS'),
  };
}

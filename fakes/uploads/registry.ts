import type { ServerResponse } from 'node:http';
import { HttpError, stringArray } from './http-util';

// What the app registered with `/route-metadata`, and the PUTs held until `/callback-result`.
// A PUT may arrive before its registration (dev mode fires it in the background), so both
// sides can wait for each other.

export interface Registration {
  fileKeys: string[];
  metadata: Record<string, unknown>;
  isDev: boolean;
  callbackUrl: string;
  callbackSlug: string;
  awaitServerData: boolean;
  /** Dev mode only: the open JSON-lines answer to `/route-metadata`. */
  devStream: ServerResponse | null;
}

export type CallbackResult = { callbackData: unknown } | { error: string };

interface Waiter<T> {
  resolve: (value: T) => void;
  timer: NodeJS.Timeout;
}

export function parseRegistration(body: Record<string, unknown>): Omit<Registration, 'devStream'> {
  const fileKeys = stringArray(body.fileKeys, 'fileKeys');
  if (typeof body.callbackUrl !== 'string') throw new HttpError(400, 'callbackUrl must be a string');
  try {
    new URL(body.callbackUrl);
  } catch {
    throw new HttpError(400, `callbackUrl "${body.callbackUrl}" is not an absolute URL`);
  }
  if (typeof body.callbackSlug !== 'string') throw new HttpError(400, 'callbackSlug must be a string');
  const metadata = body.metadata ?? {};
  if (typeof metadata !== 'object' || Array.isArray(metadata)) throw new HttpError(400, 'metadata must be an object');
  return {
    fileKeys,
    metadata: metadata as Record<string, unknown>,
    isDev: body.isDev === true,
    callbackUrl: body.callbackUrl,
    callbackSlug: body.callbackSlug,
    awaitServerData: body.awaitServerData !== false,
  };
}

export class Registry {
  private byKey = new Map<string, Registration>();
  private unfinished = new Map<Registration, Set<string>>();
  private registrationWaiters = new Map<string, Waiter<Registration | null>[]>();
  private resultWaiters = new Map<string, Waiter<CallbackResult | null>>();

  constructor(private readonly log: (line: string) => void = () => {}) {}

  register(reg: Registration, devStreamTimeoutMs: number): void {
    this.unfinished.set(reg, new Set(reg.fileKeys));
    for (const key of reg.fileKeys) {
      this.byKey.set(key, reg);
      for (const w of this.registrationWaiters.get(key) ?? []) {
        clearTimeout(w.timer);
        w.resolve(reg);
      }
      this.registrationWaiters.delete(key);
    }
    if (reg.devStream) {
      // Files never uploaded must not keep the app's stream open for ever.
      const timer = setTimeout(() => this.endStream(reg), devStreamTimeoutMs);
      timer.unref();
      reg.devStream.on('close', () => clearTimeout(timer));
    }
  }

  waitForRegistration(key: string, timeoutMs: number): Promise<Registration | null> {
    const known = this.byKey.get(key);
    if (known) return Promise.resolve(known);
    return new Promise((resolve) => {
      const list = this.registrationWaiters.get(key) ?? [];
      const waiter: Waiter<Registration | null> = {
        resolve,
        timer: setTimeout(() => {
          this.registrationWaiters.set(key, (this.registrationWaiters.get(key) ?? []).filter((w) => w !== waiter));
          resolve(null);
        }, timeoutMs),
      };
      list.push(waiter);
      this.registrationWaiters.set(key, list);
    });
  }

  /** Starts waiting for the app's result before the callback is sent, so none is missed. */
  expectResult(key: string, timeoutMs: number): Promise<CallbackResult | null> {
    this.resultWaiters.get(key)?.resolve(null);
    return new Promise((resolve) => {
      const timer = setTimeout(() => {
        this.resultWaiters.delete(key);
        resolve(null);
      }, timeoutMs);
      this.resultWaiters.set(key, { resolve, timer });
    });
  }

  /** False when no PUT is waiting (a replayed callback, or one that already timed out). */
  deliverResult(key: string, result: CallbackResult): boolean {
    const waiter = this.resultWaiters.get(key);
    if (!waiter) return false;
    clearTimeout(waiter.timer);
    this.resultWaiters.delete(key);
    waiter.resolve(result);
    return true;
  }

  cancelResult(key: string): void {
    const waiter = this.resultWaiters.get(key);
    if (!waiter) return;
    clearTimeout(waiter.timer);
    this.resultWaiters.delete(key);
  }

  /** Marks a file done (either way); a dev stream ends once all its files are. */
  finish(key: string): void {
    const reg = this.byKey.get(key);
    if (!reg) return;
    const left = this.unfinished.get(reg);
    left?.delete(key);
    if (left && left.size === 0) this.endStream(reg);
  }

  closeAll(): void {
    for (const reg of this.unfinished.keys()) this.endStream(reg);
    for (const list of this.registrationWaiters.values()) for (const w of list) (clearTimeout(w.timer), w.resolve(null));
    for (const w of this.resultWaiters.values()) (clearTimeout(w.timer), w.resolve(null));
    this.registrationWaiters.clear();
    this.resultWaiters.clear();
  }

  private endStream(reg: Registration): void {
    this.unfinished.delete(reg);
    for (const key of reg.fileKeys) if (this.byKey.get(key) === reg) this.byKey.delete(key);
    if (reg.devStream && !reg.devStream.writableEnded) {
      reg.devStream.end();
      this.log(`dev stream closed: ${reg.fileKeys.join(', ')}`);
    }
  }
}

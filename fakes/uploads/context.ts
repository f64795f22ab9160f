import type { ResolvedOptions } from './config';
import type { HookDelivery } from './callback-sender';
import type { Registry } from './registry';
import type { FileStore } from './storage';

/** What every route of the fake shares. */
export interface FakeContext {
  opts: ResolvedOptions;
  store: FileStore;
  registry: Registry;
  /** The fake's own base URL, sent as `origin` so the app knows where to post `/callback-result`. */
  origin(): string;
  /** Keys with a PUT in progress: a second PUT of the same key is refused, not interleaved. */
  uploading: Set<string>;
  /** Every hook the fake sent, oldest first (test hooks replay them). */
  hooks: HookDelivery[];
  log(line: string): void;
}

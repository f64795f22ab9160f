// Entry point: `tsx fakes/uploads/server.ts`, configured only by environment (scripts/env.sh).
import { optionsFromEnv } from './config';
import { startUploadFake } from './fake';

try {
  const options = optionsFromEnv();
  const fake = await startUploadFake({ ...options, log: (line) => console.log(`[uploads] ${line}`) });
  console.log(`[uploads] listening on ${fake.url}, files in ${options.dir}`);
  for (const signal of ['SIGINT', 'SIGTERM'] as const) {
    process.once(signal, () => void fake.close().then(() => process.exit(0)));
  }
} catch (err) {
  console.error(`[uploads] cannot start: ${(err as Error).message}`);
  process.exit(1);
}

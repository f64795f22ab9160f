/**
 * npm run seed:demo — the invented demo lab (idempotent). demo.sh runs it after migrating.
 * Prints the demo sign-ins as a Markdown table (local demo only).
 */
import { closeOrm, getEm } from '@/lib/db/orm';
import { demoSignInTable } from '@/lib/services/demo-people';
import { seedDemo } from '@/lib/services/seed';

async function main() {
  const em = await getEm();
  const { created } = await seedDemo(em);
  console.log(created ? `Demo lab seeded (${created} new rows).` : 'Demo lab already in place.');
  console.log('');
  console.log(demoSignInTable());
}

main()
  .catch((e: unknown) => {
    console.error('seed-demo failed:', e instanceof Error ? e.message : e);
    process.exitCode = 1;
  })
  .finally(() => closeOrm());

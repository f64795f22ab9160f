import { defineConfig } from '@mikro-orm/postgresql';
import { Migrator } from '@mikro-orm/migrations';
import { allEntities } from './entities';
import { databaseUrl } from './lib/config/env';

export default defineConfig({
  clientUrl: databaseUrl(),
  entities: allEntities,
  extensions: [Migrator],
  // scripts/db.sh creates the databases; the app never tries to.
  ensureDatabase: false,
  migrations: {
    path: './migrations',
    pathTs: './migrations',
    glob: '!(*.d).{js,ts}',
    emit: 'ts',
    snapshot: true,
    // One snapshot whichever database (demo or test) the migration was made against.
    snapshotName: '.snapshot-branchwise',
  },
  pool: { min: 0, max: 10 },
});

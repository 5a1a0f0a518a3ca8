import path from 'node:path';
import { loadConfig } from '../config';
import { createDb } from '../db/create-db';
import { migrateToLatest } from '../db/migrate';
import { createFileStorage } from '../storage/storage';
import { pgBossDerivativeJobs, startJobBoss } from '../jobs/job-boss';
import { seedDemo } from './seed-demo';

// `npx tsx server/demo/seed-demo-cli.ts [fixturesDir]`: migrates, then seeds the demo scenario once.
async function main(): Promise<void> {
  const config = loadConfig(process.env);
  const fixturesDir = path.resolve(process.argv[2] ?? 'fixtures');
  const db = createDb(config.databaseUrl, 2);
  try {
    await migrateToLatest(db);
    // Derivative jobs are only queued here; the worker (npm start) makes them.
    const boss = await startJobBoss(config.databaseUrl, { isWorker: false });
    try {
      const result = await seedDemo({ db, storage: createFileStorage(config.storageDir), jobs: pgBossDerivativeJobs(boss) }, { fixturesDir });
      console.log(result.isSeeded ? `Demo seeded: ${JSON.stringify(result)}` : 'The demo scenario was seeded before; nothing to do.');
    } finally {
      await boss.stop({ graceful: false, wait: true });
    }
  } finally {
    await db.destroy();
  }
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});

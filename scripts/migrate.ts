// npm run migrate: bring the database named by DATA_DIR / DATABASE_URL to the latest schema.
// `npm run migrate -- --seed` also seeds the demo scenario when the database has no users.
import { loadConfig } from '../server/config.ts';
import { createDb, migrate } from '../server/db.ts';
import { seedDemoIfEmpty } from '../seeds/demo.ts';

const config = loadConfig();
const db = createDb(config);
try {
  await migrate(db);
  console.log(`Migrated ${config.databaseUrl ? 'the PostgreSQL database' : `${config.dataDir}/stanchion.sqlite`}`);
  if (process.argv.includes('--seed')) {
    const seeded = await seedDemoIfEmpty(db, config.bcryptRounds);
    console.log(seeded ? 'Seeded the demo scenario' : 'Database already has users; demo not seeded');
  }
} finally {
  await db.destroy();
}

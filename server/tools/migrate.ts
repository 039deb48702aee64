/** `npm run db:migrate`: brings the database named by DATABASE_FILE up to date and lists what ran. */
import { loadConfig } from '../config';
import { migrateLatest, openDatabase } from '../db/database';

const config = loadConfig();
const db = openDatabase(config.databaseFile);
try {
  const applied = await migrateLatest(db);
  console.log(applied.length ? `Applied: ${applied.join(', ')}` : 'The database is up to date.');
} finally {
  await db.destroy();
}

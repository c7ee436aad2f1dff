// Migrates the database named by DATABASE_URL and seeds the demo workspaces (idempotent).
import { migrateUp } from '../backend/src/db/migrator';
import { seedDemo } from '../backend/src/db/seed';
import { sequelize } from '../backend/src/db/sequelize';

const applied = await migrateUp();
console.log(`[db] migrations applied: ${applied.length ? applied.join(', ') : 'none (up to date)'}`);
await seedDemo();
console.log('[db] demo data seeded');
await sequelize.close();

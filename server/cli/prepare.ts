import { configFromEnv } from '../config';
import { createSequelize } from '../db';
import { createMigrator } from '../migrator';
import { initModels, User } from '../models';
import { seedDemo } from '../seed/demo';

// Run by the setup scripts before the server starts: apply pending migrations, then (demo mode only)
// seed the demo data into an empty database.
const config = configFromEnv();
const wantDemo = process.argv.includes('--seed-demo');
if (wantDemo && config.mode === 'production') {
  process.stderr.write('Refusing to seed demo data in production mode.\n');
  process.exit(1);
}
const sequelize = createSequelize(config.db);
try {
  const applied = await createMigrator(sequelize).up();
  if (applied.length) process.stdout.write(`[loftbench] Applied migrations: ${applied.map((m) => m.name).join(', ')}\n`);
  initModels(sequelize);
  if (wantDemo && (await User.count()) === 0) {
    await seedDemo(sequelize);
    process.stdout.write('[loftbench] Seeded the demo hull and the three demo accounts (see README.md)\n');
  }
} finally {
  await sequelize.close();
}

// Database chores for the npm scripts: `migrate`, `seed [--reset|--if-empty]`.
import { connectDatabase } from './db/client';
import { migrateDatabase } from './db/migrate';
import { readEnv, type Env } from './env';
import { DEMO_PASSWORD, seedDemo } from './seed/demo';

let env: Env;
try {
  env = readEnv();
} catch (err) {
  // As the server does (server/index.ts): the configuration problem, without a stack trace.
  console.error((err as Error).message);
  process.exit(1);
}
const database = connectDatabase(env.DATABASE_URL, 4);
const [command, ...flags] = process.argv.slice(2);
try {
  if (command === 'migrate') {
    await migrateDatabase(database.db);
  } else if (command === 'seed') {
    const result = await seedDemo(database.db, {
      reset: flags.includes('--reset'),
      ifEmpty: flags.includes('--if-empty'),
      bcryptCost: env.BCRYPT_COST,
    });
    console.log(
      result.created
        ? `Seeded the demo collection: ${result.animals} animals, ${result.events} events (password: ${DEMO_PASSWORD}).`
        : 'The demo collection is already there (npm run db:seed -- --reset rebuilds it).',
    );
  } else {
    console.error('Usage: tsx server/cli.ts migrate | seed [--reset|--if-empty]');
    process.exitCode = 2;
  }
} finally {
  await database.close();
}

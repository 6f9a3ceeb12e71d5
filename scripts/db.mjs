// `npm run db:migrate | db:seed [-- --reset] | db:stop`
import { localSessionSecret } from './lib/secrets.mjs';
import { ensureNodeModules, prepareDatabase, runTs, say, stopCluster } from './lib/setup.mjs';

const [command, ...rest] = process.argv.slice(2);

if (command === 'stop') {
  say(stopCluster() ? 'PostgreSQL stopped.' : 'PostgreSQL was not running.');
  process.exit(0);
}

ensureNodeModules();
const { databaseUrl } = await prepareDatabase();
const env = {
  ...process.env,
  DATABASE_URL: databaseUrl,
  SESSION_SECRET: process.env.SESSION_SECRET ?? localSessionSecret(),
};
if (command === 'migrate') runTs('server/cli.ts', ['migrate'], env);
else if (command === 'seed') {
  runTs('server/cli.ts', ['migrate'], env);
  runTs('server/cli.ts', ['seed', ...rest], env);
} else {
  say('Usage: node scripts/db.mjs migrate | seed [--reset] | stop');
  process.exit(2);
}

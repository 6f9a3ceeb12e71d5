// `npm start [-- --demo | --no-demo]`: from a clean clone to a running app, with the demo
// collection or empty for the first owner to make their account.
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { lanEnv } from './lib/lan.mjs';
import { localSessionSecret } from './lib/secrets.mjs';
import { SERVER_NODE_FLAGS } from './lib/server-flags.mjs';
import {
  askLine,
  ensureNodeModules,
  fail,
  interactive,
  prepareDatabase,
  repoRoot,
  run,
  runTs,
  say,
  stopCluster,
} from './lib/setup.mjs';
import { decideDemo, demoAnswer, parseStartFlags, readRememberedDemo } from './lib/start-flags.mjs';

const began = Date.now();
const flags = parseStartFlags(process.argv.slice(2));
if (flags.error) fail(flags.error);
ensureNodeModules();

const production = process.env.NODE_ENV === 'production';
const demo = chooseDemo();

/** Demo or not: asked once on a fresh machine and kept in .data/start-mode. */
function chooseDemo() {
  const file = path.join(repoRoot, '.data', 'start-mode');
  const remembered = fs.existsSync(file)
    ? readRememberedDemo(fs.readFileSync(file, 'utf8'))
    : undefined;
  const facts = {
    envDemoMode: process.env.DEMO_MODE,
    flag: flags.demo,
    remembered,
    isTTY: interactive(),
    production,
  };
  let choice = decideDemo(facts);
  while (choice.ask) {
    say('Start with the demo collection (made-up animals, sign in as the demo keeper),');
    const typed = askLine('  or empty, so that you make the first account yourself? Demo? [Y/n] ');
    const answer = demoAnswer(typed);
    if (answer !== undefined) choice = { demo: answer, source: 'asked' };
  }
  if (choice.source === 'flag' || choice.source === 'asked') {
    fs.mkdirSync(path.dirname(file), { recursive: true });
    fs.writeFileSync(file, `${choice.demo ? 'demo' : 'no-demo'}\n`);
  }
  if (choice.source === 'default' && !production)
    say(
      'Starting with the demo collection (nobody at the terminal to ask). `npm start -- --no-demo` starts empty instead; the choice is remembered.',
    );
  else if (choice.source === 'remembered')
    say(
      `${choice.demo ? 'With the demo collection' : 'Without the demo'}, as chosen before (\`npm start -- --${choice.demo ? 'no-demo' : 'demo'}\` to change).`,
    );
  return choice.demo;
}

const { databaseUrl, startedCluster } = await prepareDatabase();

const env = {
  ...process.env,
  DATABASE_URL: databaseUrl,
  DEMO_MODE: demo ? 'true' : 'false',
  SESSION_SECRET: process.env.SESSION_SECRET ?? (production ? '' : localSessionSecret()),
};

// `npm start -- --lan`: HTTPS on the home network with a certificate made for this machine.
if (flags.lan) {
  runTs('scripts/lan-certificate.ts', [], env);
  Object.assign(env, lanEnv(process.env));
}

say('Applying database migrations…');
runTs('server/cli.ts', ['migrate'], env);
if (env.DEMO_MODE === 'true') runTs('server/cli.ts', ['seed', '--if-empty'], env);

say('Building the app…');
// What `npm run build` does, with vite's report kept short.
run(path.join(repoRoot, 'node_modules', '.bin', 'vite'), ['build', '--logLevel', 'warn'], { env });
runTs('scripts/build-server.ts', [], env);
say(`Ready to serve after ${((Date.now() - began) / 1000).toFixed(1)} s of set-up.`);

// The bundled server (scripts/build-server.ts), run by node itself.
const server = spawn(
  process.execPath,
  [...SERVER_NODE_FLAGS, path.join(repoRoot, 'dist-server', 'index.mjs')],
  {
    cwd: repoRoot,
    env,
    stdio: 'inherit',
  },
);

let stopping = false;
function shutdown() {
  if (stopping) return;
  stopping = true;
  server.kill('SIGTERM');
}
process.on('SIGINT', shutdown);
process.on('SIGTERM', shutdown);
server.on('exit', (code) => {
  if (startedCluster) {
    say('Stopping the private PostgreSQL cluster…');
    stopCluster();
  }
  process.exit(stopping ? 0 : (code ?? 1));
});

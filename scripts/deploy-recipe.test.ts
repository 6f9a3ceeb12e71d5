// The hosting recipe's files, checked where no container engine runs: the Dockerfile, the
// compose file, Caddy's file and the systemd units say what README "Hosting Rackside" promises.
// (`npm test` also builds the image when `docker info` succeeds, and says when it cannot.)
import fs from 'node:fs';
import path from 'node:path';
import prettier from 'prettier';
import { describe, expect, it } from 'vitest';

const root = path.resolve(import.meta.dirname, '..');
const read = (file: string) => fs.readFileSync(path.join(root, file), 'utf8');
/** Lines without comments, for checks that a comment must not satisfy. */
const code = (text: string) =>
  text
    .split('\n')
    .filter((l) => !/^\s*#/.test(l))
    .join('\n');
/** What production refuses to start without (server/env.ts). */
const REQUIRED = ['DATABASE_URL', 'SESSION_SECRET', 'PUBLIC_URL', 'SMTP_URL'];

describe('Dockerfile', () => {
  const text = code(read('Dockerfile'));
  const stages = text.split(/^FROM /m).slice(1);

  it('builds with every package and runs with production dependencies only', () => {
    expect(stages).toHaveLength(2);
    const [build, runtime] = stages as [string, string];
    expect(build).toMatch(/AS build/);
    expect(build).toMatch(/RUN npm ci\b(?!.*--omit=dev)/);
    expect(build).toMatch(/RUN npm run build/);
    expect(runtime).toMatch(/RUN npm ci --omit=dev/);
    expect(runtime).toMatch(/COPY --from=build \/app\/dist \.\/dist/);
    expect(runtime).toMatch(/COPY --from=build \/app\/dist-server \.\/dist-server/);
    expect(runtime).toMatch(/COPY drizzle \.\/drizzle/);
    expect(runtime).toMatch(/NODE_ENV=production/);
  });

  it('runs as a user that is not root, and checks /api/health', () => {
    const runtime = stages[1]!;
    expect(runtime).toMatch(/^USER node$/m);
    expect(runtime.indexOf('USER node')).toBeLessThan(runtime.indexOf('CMD ['));
    expect(runtime).toMatch(/HEALTHCHECK[\s\S]*\/api\/health/);
    expect(runtime).toMatch(/CMD \[.*"dist-server\/index\.mjs"\]/);
    // The route it probes is there.
    expect(read('server/app.ts')).toMatch(/api\.use\('\/health', healthRoutes/);
  });

  it('builds from what it needs: the build script exists, and local data stays out', () => {
    const pkg = JSON.parse(read('package.json')) as { scripts: Record<string, string> };
    expect(pkg.scripts.build).toMatch(/build-server/);
    const ignored = read('.dockerignore').split('\n');
    for (const p of ['node_modules', '.data', '.env', 'dist', 'dist-server', '.git'])
      expect(ignored).toContain(p);
  });
});

describe('compose.yaml', () => {
  const raw = read('compose.yaml');
  const text = code(raw);

  it('is YAML', async () => {
    await expect(prettier.format(raw, { parser: 'yaml' })).resolves.toBeTruthy();
  });

  it('has PostgreSQL from its official image, a one-shot migrate, two replicas and Caddy', () => {
    expect(text).toMatch(/^ {2}db:\n {4}image: postgres:\d+/m);
    expect(text).toMatch(/pg_isready/);
    expect(text).toMatch(
      /^ {2}migrate:[\s\S]*?command: \['node', 'dist-server\/cli\.mjs', 'migrate'\]/m,
    );
    expect(text).toMatch(/^ {2}app-1: \*app$/m);
    expect(text).toMatch(/^ {2}app-2: \*app$/m);
    // The replicas start after the migration has finished, on a healthy database.
    expect(text).toMatch(/migrate:\n {6}condition: service_completed_successfully/);
    expect(text).toMatch(/db:\n {6}condition: service_healthy/);
    expect(text).toMatch(/^ {2}proxy:\n {4}image: caddy:2/m);
    expect(text).toMatch(/- '443:443'/);
    expect(text).toMatch(/\.\/deploy\/Caddyfile:\/etc\/caddy\/Caddyfile:ro/);
    // Photos on one volume that every replica shares.
    expect(text).toMatch(/- storage:\/data\/storage/);
  });

  it('gives the app every production setting, refusing to start without one', () => {
    for (const name of REQUIRED) expect(text).toMatch(new RegExp(`^ {4}${name}: `, 'm'));
    for (const name of ['POSTGRES_PASSWORD', 'SESSION_SECRET', 'RACKSIDE_DOMAIN', 'SMTP_URL'])
      expect(text).toContain(`\${${name}:?`);
    const example = read('deploy/compose.env.example');
    for (const name of ['POSTGRES_PASSWORD', 'SESSION_SECRET', 'RACKSIDE_DOMAIN', 'SMTP_URL'])
      expect(example).toMatch(new RegExp(`^${name}=`, 'm'));
  });

  it('has Caddy balance both replicas over HTTPS for the domain, checking their health', () => {
    const caddy = code(read('deploy/Caddyfile'));
    expect(caddy).toMatch(/^\{\$RACKSIDE_DOMAIN\} \{/m);
    expect(caddy).toMatch(/reverse_proxy app-1:3000 app-2:3000/);
    expect(caddy).toMatch(/health_uri \/api\/health/);
    // TRUST_PROXY=1: the one hop Caddy adds, so cookies are Secure behind it.
    expect(text).toMatch(/TRUST_PROXY: '1'/);
  });
});

describe('systemd', () => {
  const unit = code(read('deploy/rackside.service'));
  const setting = (name: string) => new RegExp(`^${name}=(.*)$`, 'm').exec(unit)?.[1];

  it('runs the bundled server as its own user with its settings from a file', () => {
    expect(setting('User')).toBe('rackside');
    expect(setting('User')).not.toBe('root');
    expect(setting('EnvironmentFile')).toBe('/etc/rackside/rackside.env');
    expect(unit).toMatch(/^Environment=NODE_ENV=production$/m);
    expect(setting('ExecStartPre')).toMatch(/dist-server\/cli\.mjs migrate$/);
    expect(setting('ExecStart')).toMatch(/dist-server\/index\.mjs$/);
    expect(setting('Restart')).toBe('on-failure');
    const example = read('deploy/rackside.env.example');
    for (const name of REQUIRED) expect(example).toMatch(new RegExp(`^${name}=`, 'm'));
  });

  it('is hardened', () => {
    expect(setting('NoNewPrivileges')).toBe('yes');
    expect(setting('ProtectSystem')).toBe('strict');
    expect(setting('ProtectHome')).toBe('yes');
    expect(setting('PrivateTmp')).toBe('yes');
    expect(setting('CapabilityBoundingSet')).toBe('');
  });

  it('backs the database up daily with pg_dump', () => {
    expect(read('deploy/rackside-db-backup.service')).toMatch(/pg_dump --format=custom/);
    expect(read('deploy/rackside-db-backup.timer')).toMatch(/^OnCalendar=.*03:30/m);
  });
});

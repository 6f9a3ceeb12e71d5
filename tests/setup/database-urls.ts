/** Where the test databases live: TEST_DATABASE_URL names the template database. */
function base(): URL {
  const raw = process.env.TEST_DATABASE_URL;
  if (!raw) throw new Error('TEST_DATABASE_URL is not set: run the tests with `npm test`.');
  return new URL(raw);
}
export function templateName(): string {
  return base().pathname.slice(1);
}
export function testDatabaseUrl(name: string): string {
  const url = base();
  url.pathname = `/${name}`;
  return url.toString();
}
export function adminUrl(): string {
  return testDatabaseUrl('postgres');
}

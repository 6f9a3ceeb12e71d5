import { afterEach, vi } from 'vitest';

// House rule: any console.error during a test fails it.
let errors: unknown[][] = [];
const original = console.error;
vi.spyOn(console, 'error').mockImplementation((...args: unknown[]) => {
  errors.push(args);
  original(...args);
});
afterEach(() => {
  const seen = errors;
  errors = [];
  if (seen.length)
    throw new Error(`console.error was called during the test: ${String(seen[0]?.[0])}`);
});

// Loaded with `node --import`: writes every module URL the process resolves to the file named
// by RACKSIDE_IMPORT_LOG, so a test can see which packages a server really loaded.
import fs from 'node:fs';
import { register } from 'node:module';
import { isMainThread } from 'node:worker_threads';

// The same file serves as the hooks module, which Node runs on a thread of its own.
if (isMainThread) register(import.meta.url);

export async function resolve(specifier, context, nextResolve) {
  const resolved = await nextResolve(specifier, context);
  if (process.env.RACKSIDE_IMPORT_LOG)
    fs.appendFileSync(process.env.RACKSIDE_IMPORT_LOG, `${resolved.url}\n`);
  return resolved;
}

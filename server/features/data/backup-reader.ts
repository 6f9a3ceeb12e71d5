import fs from 'node:fs';
import { JSONParser } from '@streamparser/json';
import { HttpError } from '../../middleware/errors';

export const BACKUP_LISTS = [
  'locations',
  'animals',
  'eggSacs',
  'events',
  'colonies',
  'colonyStockChanges',
  'chores',
  'roomTargets',
  'climateReadings',
  // Sales — S (version 3).
  'salesSettings',
  'buyers',
  'saleListings',
  'sales',
  'invoices',
  'payments',
] as const;
export type BackupList = (typeof BACKUP_LISTS)[number];
const SINGLE = ['format', 'version', 'exportedAt', 'collection'] as const;

export type BackupRecord =
  | { kind: 'single'; key: (typeof SINGLE)[number]; value: unknown }
  /** One element of a list, numbered from 0 within its list. */
  | { kind: 'item'; list: BackupList; index: number; value: unknown };

const badJson = (err: Error) => {
  const at = /position "(\d+)"/.exec(err.message)?.[1];
  return new HttpError(
    400,
    'bad_json',
    `This file is not valid JSON${at ? ` (a mistake near byte ${at})` : ''}: it may be damaged, or not a backup.`,
  );
};

/**
 * A backup file's top-level values and its lists' elements one at a time, in file order, with
 * only the current element in memory: the parser forgets each element once it is handed on
 * (keepStack: false), and members we do not know are skipped without being kept.
 */
export async function* readBackup(file: string): AsyncGenerator<BackupRecord> {
  const parser = new JSONParser({
    // Only the lists' elements, never the lists: a path for a list would make the parser keep
    // every element until the list closes, to hand it over whole.
    paths: [...SINGLE.map((k) => `$.${k}`), ...BACKUP_LISTS.map((l) => `$.${l}.*`)],
    keepStack: false,
    stringBufferSize: 64 * 1024,
  });
  const ready: BackupRecord[] = [];
  // Set from the parser's callbacks: an object, so the checks below are not narrowed away.
  const state: { failure: HttpError | null } = { failure: null };
  parser.onValue = ({ value, key, parent, stack }) => {
    if (stack.length === 1) {
      ready.push({ kind: 'single', key: key as (typeof SINGLE)[number], value });
      return;
    }
    const list = stack[1]?.key as BackupList;
    if (!Array.isArray(parent)) {
      state.failure ??= new HttpError(
        422,
        'invalid',
        `This file is not a Rackside backup: “${list}” should be a list.`,
      );
      return;
    }
    ready.push({ kind: 'item', list, index: key as number, value });
  };
  parser.onError = (err) => {
    state.failure ??= badJson(err);
  };

  const take = function* () {
    if (state.failure) throw state.failure;
    for (const record of ready) yield record;
    ready.length = 0;
  };
  for await (const chunk of fs.createReadStream(file, { highWaterMark: 64 * 1024 })) {
    // Nothing after the one JSON value but white space.
    if (parser.isEnded) {
      if ((chunk as Buffer).toString('latin1').trim())
        throw new HttpError(
          400,
          'bad_json',
          'This file has more after the backup ends: it may be damaged, or not a backup.',
        );
      continue;
    }
    parser.write(chunk as Buffer);
    yield* take();
  }
  if (!parser.isEnded) parser.end();
  if (state.failure?.code === 'bad_json')
    throw new HttpError(
      400,
      'bad_json',
      'This file ends before the backup does: it may not have finished downloading.',
    );
  yield* take();
}

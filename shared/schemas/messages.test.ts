import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { fieldLabel, isGenericMessage } from './messages';

describe('readable validation messages', () => {
  const first = (schema: z.ZodType, value: unknown) =>
    schema.safeParse(value).error!.issues[0]!.message;

  it('says what to do for the built-in checks', () => {
    expect(first(z.object({ name: z.string() }), {})).toBe('This is required.');
    expect(first(z.string(), 5)).toBe('This should be text.');
    expect(first(z.number(), 'five')).toBe('This should be a number.');
    expect(first(z.enum(['a4', 'letter']), 'a3')).toBe('Choose one of "a4", "letter".');
    expect(first(z.string().min(1), '')).toBe('This cannot be empty.');
    expect(first(z.string().max(3), 'abcd')).toBe('Use at most 3 characters.');
    expect(first(z.number().max(90), 91)).toBe('Use 90 or less.');
    expect(first(z.array(z.number()).min(2), [1])).toBe('Use at least 2 items.');
    expect(first(z.uuid(), 'x')).toBe('This id is not valid.');
    expect(first(z.strictObject({}), { extra: 1 })).toBe('Unexpected field: extra.');
  });

  it('keeps a schema’s own message', () => {
    expect(first(z.string({ message: 'Name the rack.' }), undefined)).toBe('Name the rack.');
  });

  it('names the field a path points at', () => {
    expect(fieldLabel('body.care.intervalDays')).toBe('Interval days');
    expect(fieldLabel('body.events.3.animalId')).toBe('Animal id');
    expect(fieldLabel('query.token')).toBe('Token');
  });
});

describe('generic messages', () => {
  it('are told apart from a schema’s own', () => {
    expect(isGenericMessage('This is required.')).toBe(true);
    expect(isGenericMessage('Use at most 3 characters.')).toBe(true);
    expect(isGenericMessage('This date does not exist.')).toBe(false);
  });
});

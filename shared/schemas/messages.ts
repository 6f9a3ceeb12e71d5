// Plain-language messages for zod's built-in checks, used wherever a schema gives no message of
// its own (a schema's own `{ message }` always wins). People read these in forms and in API
// errors, so they say what to do rather than what the parser expected.
import { z } from 'zod';
import type { $ZodRawIssue } from 'zod/v4/core';

type Issue = $ZodRawIssue;

const TYPE_WORDS: Record<string, string> = {
  string: 'text',
  number: 'a number',
  int: 'a whole number',
  boolean: 'yes or no (true or false)',
  array: 'a list',
  object: 'a group of fields',
  date: 'a date',
  bigint: 'a number',
};

const SIZE_UNITS: Record<string, [string, string]> = {
  string: ['at least {n} characters', 'at most {n} characters'],
  array: ['at least {n} items', 'at most {n} items'],
  set: ['at least {n} items', 'at most {n} items'],
  file: ['at least {n} bytes', 'at most {n} bytes'],
};

export function readableMessage(issue: Issue): string | undefined {
  switch (issue.code) {
    case 'invalid_type':
      if (issue.input === undefined) return 'This is required.';
      return `This should be ${TYPE_WORDS[issue.expected] ?? issue.expected}.`;
    case 'invalid_value': {
      const values = issue.values.map((v: unknown) => JSON.stringify(v));
      return values.length <= 10
        ? `Choose one of ${values.join(', ')}.`
        : 'This value is not one of the choices.';
    }
    case 'too_small': {
      if (issue.origin === 'string' && Number(issue.minimum) === 1) return 'This cannot be empty.';
      const unit = SIZE_UNITS[issue.origin];
      if (unit) return `Use ${unit[0].replace('{n}', String(issue.minimum))}.`;
      return `Use ${String(issue.minimum)} or more.`;
    }
    case 'too_big': {
      const unit = SIZE_UNITS[issue.origin];
      if (unit) return `Use ${unit[1].replace('{n}', String(issue.maximum))}.`;
      return `Use ${String(issue.maximum)} or less.`;
    }
    case 'invalid_format':
      if (issue.format === 'uuid') return 'This id is not valid.';
      if (issue.format === 'email') return 'Enter an e-mail address such as name@example.com.';
      if (issue.format === 'datetime') return 'Give a date and time such as 2026-12-02T09:30:00Z.';
      return 'This is not in the expected form.';
    case 'not_multiple_of':
      return `Use a multiple of ${String(issue.divisor)}.`;
    case 'unrecognized_keys':
      return `Unexpected field${issue.keys.length > 1 ? 's' : ''}: ${issue.keys.join(', ')}.`;
    case 'invalid_union':
      return 'This does not match any of the accepted forms.';
    case 'invalid_key':
    case 'invalid_element':
      return 'Something in this list is not valid.';
    default:
      return 'This value is not accepted.';
  }
}

z.config({ customError: readableMessage });

const GENERIC =
  /^(This is required|This should be |Choose one of |This cannot be empty|Use |This id is not valid|This is not in the expected form|This value is not|This does not match|Something in this list|Unexpected field)/;

/** Whether a message is one of the generic ones above, which make sense only beside their field. */
export const isGenericMessage = (message: string) => GENERIC.test(message);

/** `body.care.intervalDays` → "Interval days": the field a message is about, for one-line errors. */
export function fieldLabel(path: string): string {
  const last =
    path
      .split('.')
      .filter((p) => !/^\d+$/.test(p))
      .pop() ?? path;
  const words = last
    .replace(/([a-z])([A-Z])/g, '$1 $2')
    .replace(/[_-]+/g, ' ')
    .toLowerCase();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

import type { FieldErrors, UseFormRegisterReturn } from 'react-hook-form';
import { PASSWORD_MIN_CHARS } from '#shared/schemas/auth';
import { PasswordField } from '@/components/ui/password-field';
import { TextField } from '@/components/ui/text-field';

type AccountField = 'displayName' | 'password' | 'collectionName' | 'timeZone';

/** The time zone a new account's rounds start in: this device's own. */
export const deviceZone = Intl.DateTimeFormat().resolvedOptions().timeZone;

/**
 * A new account's own details and its first collection, as every way of making an account asks
 * for them (a sign-up link, the first owner of an empty server).
 */
export function AccountFields({
  register,
  errors,
}: {
  register: (name: AccountField) => UseFormRegisterReturn;
  errors: FieldErrors<Record<AccountField, unknown>>;
}) {
  return (
    <>
      <TextField
        label="Your name"
        autoComplete="name"
        error={errors.displayName?.message}
        {...register('displayName')}
      />
      <PasswordField
        label="Password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_CHARS} characters. A few words you will remember work well.`}
        error={errors.password?.message}
        {...register('password')}
      />
      <TextField
        label="Collection name"
        hint="For example: Spare room racks"
        error={errors.collectionName?.message}
        {...register('collectionName')}
      />
      <TextField
        label="Time zone"
        hint="Your rounds follow the calendar days of this zone."
        autoComplete="off"
        error={errors.timeZone?.message}
        {...register('timeZone')}
      />
    </>
  );
}

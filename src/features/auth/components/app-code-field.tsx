import type { ComponentProps } from 'react';
import { TextField } from '@/components/text-field';

/** The 6-digit code an authenticator app shows (time-based, RFC 6238), typed on the number pad. */
export function AppCodeField(props: Omit<ComponentProps<typeof TextField>, 'label'>) {
  return (
    <TextField label="Code from your app" inputMode="numeric" autoComplete="one-time-code" maxLength={6} {...props} />
  );
}

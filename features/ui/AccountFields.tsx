import type { ComponentProps } from 'react';
import { TextField } from './TextField';

type FieldProps = Omit<ComponentProps<typeof TextField>, 'label'> & { label?: string };

/** An e-mail input: no capitals, the e-mail keyboard, and the browser's address autofill. */
export function EmailField({ label = 'E-mail', ...rest }: FieldProps) {
  return <TextField label={label} autoCapitalize="none" autoComplete="email" keyboardType="email-address" {...rest} />;
}

/** A password input; `choosing` marks a new password so browsers offer to generate and save one. */
export function PasswordField({ label = 'Password', choosing = false, ...rest }: FieldProps & { choosing?: boolean }) {
  return (
    <TextField
      label={label}
      secureTextEntry
      autoComplete={choosing ? 'new-password' : 'current-password'}
      hint={choosing ? 'At least 10 characters.' : undefined}
      {...rest}
    />
  );
}

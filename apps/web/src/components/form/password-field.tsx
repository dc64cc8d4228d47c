import { useId, useState } from 'react';
import { TextField, type TextFieldProps } from './text-field';

type PasswordFieldProps = Omit<TextFieldProps, 'type' | 'adornment'>;

/** A password input with a Show button: long passphrases are easier to type when they can be checked. */
export function PasswordField({ id, ...props }: PasswordFieldProps) {
  const [shown, setShown] = useState(false);
  const generated = useId();
  const inputId = id ?? generated;
  return (
    <TextField
      {...props}
      id={inputId}
      type={shown ? 'text' : 'password'}
      spellCheck={false}
      autoCapitalize="none"
      adornment={
        <button
          type="button"
          aria-pressed={shown}
          aria-controls={inputId}
          aria-label={`Show ${props.label.toLowerCase()}`}
          onClick={() => setShown((value) => !value)}
          className="min-h-touch shrink-0 rounded border border-line-strong bg-surface px-3 text-base font-medium text-ink hover:bg-sunken desk:min-h-control desk:text-sm"
        >
          Show
        </button>
      }
    />
  );
}

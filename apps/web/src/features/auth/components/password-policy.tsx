import { passwordLength } from '@varden/schemas';

/** NIST SP 800-63B in Varden's words: length matters, composition rules do not. */
export function PasswordPolicy({ id }: { id?: string }) {
  return (
    <div id={id} className="rounded bg-sunken p-3 text-base desk:text-sm">
      <p className="font-medium">What makes a good password here</p>
      <ul className="mt-1 list-disc pl-5 text-ink-muted">
        <li>At least {passwordLength.min} characters; up to {passwordLength.max}.</li>
        <li>Passphrases welcome: a few unrelated words with spaces are long and easy to remember.</li>
        <li>No rules about digits, capitals or symbols.</li>
        <li>Varden refuses passwords on a list of commonly used ones, simple patterns and your own e-mail address.</li>
      </ul>
    </div>
  );
}

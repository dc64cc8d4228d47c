import { EntryPanel } from '../../features/auth/components/entry-panel';
import { ResetPasswordForm } from '../../features/auth/components/reset-password-form';

export default function ResetPasswordRoute() {
  return (
    <EntryPanel
      title="Reset your password"
      lead="Give the address you sign in with. If it belongs to an account, Varden mails it a link to choose a new password; the link works for 1 hour."
    >
      <ResetPasswordForm />
    </EntryPanel>
  );
}

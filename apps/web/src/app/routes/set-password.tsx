import { tokenPurposes, type TokenPurpose } from '@varden/schemas';
import { Link, useSearchParams } from 'react-router-dom';
import { FormAlert } from '../../components/form/form-alert';
import { paths } from '../../config/paths';
import { EntryPanel } from '../../features/auth/components/entry-panel';
import { SetPasswordForm } from '../../features/auth/components/set-password-form';

const purposeOf = (value: string | null): TokenPurpose => tokenPurposes.find((purpose) => purpose === value) ?? 'reset';

/** Opened from the link in an invitation or reset mail: ?token=…&purpose=invitation|reset. */
export default function SetPasswordRoute() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const purpose = purposeOf(params.get('purpose'));
  const invitation = purpose === 'invitation';
  return (
    <EntryPanel
      title={invitation ? 'Choose your password' : 'Choose a new password'}
      lead={
        invitation
          ? 'Welcome to Varden. Choose the password you will sign in with; your e-mail address is your sign-in name.'
          : 'Once it is set, every device signed in to your account is signed out.'
      }
    >
      {token.length < 20 ? (
        <FormAlert>
          <p className="font-medium">This link is incomplete.</p>
          <p className="mt-1">
            Open the link from the mail again, all of it.{' '}
            {invitation ? 'If it still fails, ask your administrator to invite you again.' : <Link to={paths.resetPassword.getHref()}>Or get a new link</Link>}
          </p>
        </FormAlert>
      ) : (
        <SetPasswordForm token={token} purpose={purpose} />
      )}
    </EntryPanel>
  );
}

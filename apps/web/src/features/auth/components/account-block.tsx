import { useMutation, useQueryClient } from '@tanstack/react-query';
import { Link, useNavigate } from 'react-router-dom';
import { paths } from '../../../config/paths';
import { signOut } from '../api/auth-requests';
import type { SessionResponse } from '../api/session-queries';
import type { LocationNotice } from '../lib/location-notice';
import { roleList } from '../lib/role-labels';
import { replaceSession } from '../lib/session-cache';

type AccountBlockProps = {
  me: SessionResponse;
  /** Called before leaving, so the phone menu closes. */
  onNavigate?: () => void;
};

const frameAction =
  'flex min-h-touch w-full items-center rounded px-3 text-left text-base text-frame-ink hover:bg-frame-active desk:min-h-control desk:text-sm';

/** The user menu in the frame: who is signed in, with what roles, and the way to change the password or sign out. */
export function AccountBlock({ me, onNavigate }: AccountBlockProps) {
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  const signingOut = useMutation({
    mutationFn: signOut,
    onSuccess: async () => {
      onNavigate?.();
      replaceSession(queryClient, null);
      const state: LocationNotice = { notice: 'You are signed out.' };
      await navigate(paths.signIn.getHref(), { replace: true, state });
    },
  });

  return (
    <section aria-label="Your account" className="grid gap-1 border-t border-frame-active pt-3">
      <p className="px-3 font-semibold text-frame-ink" data-testid="account-name">
        {me.user.name}
      </p>
      <p className="px-3 pb-1 text-base text-frame-ink-muted desk:text-sm">{roleList(me.user.roles) || 'No role yet'}</p>
      <Link to={paths.account.getHref()} onClick={onNavigate} className={`${frameAction} no-underline`}>
        Change password
      </Link>
      <button type="button" className={frameAction} disabled={signingOut.isPending} onClick={() => signingOut.mutate()}>
        {signingOut.isPending ? 'Signing out…' : 'Sign out'}
      </button>
    </section>
  );
}

import type { QueryClient } from '@tanstack/react-query';
import { redirect, useLocation, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { FormSuccess } from '../../components/form/form-alert';
import { EntryPanel } from '../../features/auth/components/entry-panel';
import { SignInForm } from '../../features/auth/components/sign-in-form';
import { noticeFrom } from '../../features/auth/lib/location-notice';
import { destinationAfterSignIn, loadSession } from '../../features/auth/lib/route-guards';
import { safeNext } from '../../features/auth/lib/safe-next';

/** Someone already signed in goes straight on. */
export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    const me = await loadSession(queryClient);
    if (me) throw redirect(destinationAfterSignIn(me, new URL(request.url).searchParams.get('next')));
    return null;
  };

export default function SignInRoute() {
  const [params] = useSearchParams();
  const location = useLocation();
  const notice = noticeFrom(location.state);
  const next = params.get('next');
  return (
    <EntryPanel title="Sign in" lead="The maintenance record of your capacitor banks: plans, readings and signed-off work.">
      {notice ? (
        <FormSuccess className="mb-4">
          <p className="font-medium">{notice.notice}</p>
        </FormSuccess>
      ) : (
        safeNext(next) && <p className="mb-4 text-ink-muted">Sign in to open the page you asked for.</p>
      )}
      <SignInForm next={next} initialEmail={notice?.email} />
    </EntryPanel>
  );
}

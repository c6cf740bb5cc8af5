import { Navigate, Outlet, useLocation } from 'react-router';
import { FormError } from '@/components/ui/form-error';
import { LoadingBlock } from '@/components/ui/spinner';
import { signInPath } from '@/lib/safe-next';
import { useMe } from '@/api/me/get-me';

/** Signed-out visitors go to sign-in and come back to the page they asked for. */
export function RequireSignIn() {
  const me = useMe();
  const location = useLocation();
  if (me.isPending) return <LoadingBlock />;
  if (me.isError)
    return (
      <div className="p-8">
        <FormError error={me.error} />
      </div>
    );
  if (!me.data) return <Navigate to={signInPath(location.pathname + location.search)} replace />;
  return <Outlet />;
}

import { useQueryClient } from '@tanstack/react-query';
import { useLocation, useNavigate, useSearchParams } from 'react-router-dom';
import { PublicPage } from '@/components/ui/public-page';
import { rememberMe, useMe } from '@/features/auth/api/get-me';
import { chooseCollectionOnDevice } from '@/features/auth/hooks/use-current-collection';
import { AcceptInvite } from '@/features/cover/components/accept-invite';
import { queryKeys } from '@/lib/query-keys';

/** /cover/accept?token=… (a helper's cover) and /join?token=… (a keeper's invite), signed in or not. */
export function CoverAcceptRoute() {
  const [params] = useSearchParams();
  const { pathname } = useLocation();
  const me = useMe();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  return (
    <PublicPage title={pathname === '/join' ? 'Your invite' : 'Your cover'}>
      <AcceptInvite
        token={params.get('token') ?? ''}
        me={me.data ?? null}
        onAccepted={(next, collectionId) => {
          queryClient.setQueryData(queryKeys.auth.me(), next);
          void rememberMe(next);
          chooseCollectionOnDevice(collectionId);
          navigate('/today', { replace: true });
        }}
      />
    </PublicPage>
  );
}

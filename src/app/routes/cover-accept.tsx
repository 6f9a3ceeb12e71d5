import { useQueryClient } from '@tanstack/react-query';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { PublicPage } from '@/components/ui/public-page';
import { rememberMe, useMe } from '@/features/auth/api/get-me';
import { authKeys } from '@/features/auth/api/keys';
import { chooseCollectionOnDevice } from '@/features/auth/hooks/use-current-collection';
import { AcceptInvite } from '@/features/cover/components/accept-invite';

/** /cover/accept?token=…: reached from the invite e-mail, signed in or not. */
export function CoverAcceptRoute() {
  const [params] = useSearchParams();
  const me = useMe();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  return (
    <PublicPage title="Your cover">
      <AcceptInvite
        token={params.get('token') ?? ''}
        me={me.data ?? null}
        onAccepted={(next, collectionId) => {
          queryClient.setQueryData(authKeys.me(), next);
          void rememberMe(next);
          chooseCollectionOnDevice(collectionId);
          navigate('/today', { replace: true });
        }}
      />
    </PublicPage>
  );
}

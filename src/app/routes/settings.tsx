import { useQueryClient } from '@tanstack/react-query';
import { Link, useNavigate } from 'react-router-dom';
import { useShell } from '@/app/layout/use-shell';
import { Notice } from '@/components/ui/notice';
import { SafetyNote } from '@/components/ui/safety-note';
import { rememberMe } from '@/features/auth/api/get-me';
import { useSignOut } from '@/features/auth/api/sign-out';
import { ChangePasswordForm } from '@/features/auth/components/change-password-form';
import { CollectionSwitcher } from '@/features/auth/components/collection-switcher';
import { chooseCollectionOnDevice } from '@/features/auth/hooks/use-current-collection';
import { LeaveCover } from '@/features/cover/components/leave-cover';
import { useMembers } from '@/features/members/api/list-members';
import { LeaveCollection } from '@/features/members/components/leave-collection';
import { DataPanel } from '@/features/settings/components/data-panel';
import { DeleteCollection } from '@/features/settings/components/delete-collection';
import { PhoneSetup } from '@/features/settings/components/phone-setup';
import { ThemePicker } from '@/features/settings/components/theme-picker';
import { UnitPicker } from '@/features/settings/components/unit-picker';
import { SignOutButton } from '@/features/sync/components/sign-out-button';
import { StorageStatus } from '@/features/sync/components/storage-status';
import { queryKeys } from '@/lib/query-keys';

export function SettingsRoute() {
  const { me, collection, chooseCollection } = useShell();
  const signOut = useSignOut();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  // An owner may leave only while a co-owner stays.
  const members = useMembers(collection?.collectionId ?? '', collection?.role === 'owner');
  const coOwned = (members.data?.members.filter((m) => m.role === 'owner').length ?? 0) > 1;
  // The collection is gone: the person's list of collections is read again, and the app falls
  // back to another one of theirs (or says they have none).
  const onDeleted = async () => {
    // As after leaving: the phone's copy of `me` must not offer the deleted collection.
    const others = me.memberships.filter((m) => m.collectionId !== collection?.collectionId);
    await rememberMe({ ...me, memberships: others });
    const next = others.find((m) => m.role === 'owner') ?? others[0];
    if (next) chooseCollectionOnDevice(next.collectionId);
    void queryClient.invalidateQueries({ queryKey: queryKeys.auth.me() });
    navigate('/today', { replace: true });
  };
  return (
    <div className="flex flex-col gap-6">
      <h1 className="text-3xl font-extrabold">Settings</h1>
      <ThemePicker />
      <UnitPicker />
      <PhoneSetup />
      {collection && collection.role !== 'helper' && (
        <Link
          to="/cover"
          className="flex min-h-target items-center justify-between rounded-xl border-2 border-border bg-surface px-3 font-bold"
        >
          Cover for a helper
          <span aria-hidden="true">›</span>
        </Link>
      )}
      {collection?.role === 'helper' && (
        <LeaveCover
          collectionId={collection.collectionId}
          onLeft={() => window.location.assign('/today')}
        />
      )}
      {collection && collection.role !== 'helper' && (
        <Link
          to="/settings/rules"
          className="flex min-h-target items-center justify-between rounded-xl border-2 border-border bg-surface px-3 font-bold"
        >
          Round rules
          <span aria-hidden="true">›</span>
        </Link>
      )}
      {collection && collection.role !== 'helper' && (
        <Link
          to="/colonies"
          className="flex min-h-target items-center justify-between rounded-xl border-2 border-border bg-surface px-3 font-bold"
        >
          Feeder colonies
          <span aria-hidden="true">›</span>
        </Link>
      )}
      {collection && collection.role !== 'helper' && (
        <DataPanel collectionId={collection.collectionId} isOwner={collection.role === 'owner'} />
      )}
      {collection?.role === 'owner' && (
        <Link
          to="/settings/people"
          className="flex min-h-target items-center justify-between rounded-xl border-2 border-border bg-surface px-3 font-bold"
        >
          People: invite a partner or a keeper
          <span aria-hidden="true">›</span>
        </Link>
      )}
      {(collection?.role === 'keeper' || (collection?.role === 'owner' && coOwned)) && (
        <LeaveCollection
          collectionId={collection.collectionId}
          collectionName={collection.collectionName}
          onLeft={async () => {
            // The phone's copy of `me` opens the app first: it must not offer the collection just left.
            const others = me.memberships.filter((m) => m.collectionId !== collection.collectionId);
            await rememberMe({ ...me, memberships: others });
            const next = others.find((m) => m.role === 'owner') ?? others[0];
            if (next) chooseCollectionOnDevice(next.collectionId);
            window.location.assign('/today');
          }}
        />
      )}
      {collection?.role === 'owner' && (
        <DeleteCollection
          key={collection.collectionId}
          collectionId={collection.collectionId}
          collectionName={collection.collectionName}
          onDeleted={onDeleted}
        />
      )}
      {me.memberships.length > 0 && (
        <CollectionSwitcher
          memberships={me.memberships}
          currentId={collection?.collectionId}
          onChoose={chooseCollection}
        />
      )}
      <Link
        to="/collections/new"
        className="flex min-h-target items-center justify-between rounded-xl border-2 border-border bg-surface px-3 font-bold"
      >
        Start another collection
        <span aria-hidden="true">›</span>
      </Link>
      <section aria-labelledby="account-heading" className="flex flex-col gap-3">
        <h2 id="account-heading" className="text-xl font-extrabold">
          Account
        </h2>
        <p>
          Signed in as <span className="font-bold">{me.user.displayName}</span>, with{' '}
          <span className="break-all font-bold">{me.user.email}</span>
        </p>
        <ChangePasswordForm />
      </section>
      {signOut.isError && <Notice tone="error" title={signOut.error.message} />}
      <StorageStatus />
      <SignOutButton
        busy={signOut.isPending}
        onSignOut={() =>
          signOut.mutate(undefined, { onSuccess: () => navigate('/sign-in', { replace: true }) })
        }
      />
      <SafetyNote />
    </div>
  );
}

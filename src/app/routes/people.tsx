import { useShell } from '@/app/layout/use-shell';
import { Notice } from '@/components/ui/notice';
import { MembersPanel } from '@/features/members/components/members-panel';

/** The owner's people: members, invites to a keeper or a partner, and unanswered invites. */
export function PeopleRoute() {
  const { me, collection } = useShell();
  if (!collection || collection.role !== 'owner')
    return <Notice tone="info" title="The collection’s owners invite people to keep it." />;
  return (
    <div className="flex flex-col gap-4">
      <h1 className="text-3xl font-extrabold">People</h1>
      <p className="text-muted">
        Invite your partner to own {collection.collectionName} with you, or someone to keep it. For
        a few days’ help with the feeds, ask for a cover instead.
      </p>
      <MembersPanel
        collectionId={collection.collectionId}
        ownUserId={me.user.id}
        timeZone={collection.timeZone}
      />
    </div>
  );
}

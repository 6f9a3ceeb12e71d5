import { useEffect } from 'react';
import { useParams } from 'react-router-dom';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { usePublishedList } from '@/features/availability/api/availability-api';
import { PublishedList } from '@/features/availability/components/published-list';

/** A breeder's public availability list: no sign-in, no app chrome, just the list. */
export function AvailabilityRoute() {
  const { token = '' } = useParams();
  const list = usePublishedList(token);
  const name = list.data?.collectionName;
  useEffect(() => {
    document.title = name ? `${name} — available now` : 'Available now';
  }, [name]);
  return (
    <main className="mx-auto flex min-h-dvh max-w-6xl flex-col gap-4 px-4 py-6">
      {list.isPending && <Loading />}
      {list.isError && (
        <>
          <h1 className="text-3xl font-extrabold">List not found</h1>
          <Notice
            tone="info"
            title="This list is not available. The link may have been replaced: ask the breeder for a new one."
          />
        </>
      )}
      {list.data && (
        <>
          <header>
            <h1 className="text-3xl font-extrabold">{list.data.collectionName}</h1>
            <p className="text-lg text-muted">Available now</p>
          </header>
          <PublishedList
            list={list.data}
            csvHref={`/api/available/${encodeURIComponent(token)}/list.csv`}
          />
        </>
      )}
    </main>
  );
}

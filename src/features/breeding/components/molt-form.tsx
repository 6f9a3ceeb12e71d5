import { lazy, Suspense } from 'react';
import { Loading } from '@/components/ui/spinner';
import type { MoltFormProps } from './molt-record-form';

// Today's round shows this form only after a Molted tap: it and its checks load then, from the
// service worker's cache when offline, so the round's first bundle stays small (P4).
const MoltRecordForm = lazy(() =>
  import('./molt-record-form').then((m) => ({ default: m.MoltRecordForm })),
);

/** A molt with what it showed; see `MoltRecordForm`. */
export function MoltForm(props: MoltFormProps) {
  return (
    <Suspense fallback={<Loading />}>
      <MoltRecordForm {...props} />
    </Suspense>
  );
}

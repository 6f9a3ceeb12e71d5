import { useNavigate } from 'react-router-dom';
import { NewCollectionForm } from '@/features/auth/components/new-collection-form';

/** Another collection of one's own: a partner's, one to restore a backup into, or a fresh start. */
export function NewCollectionRoute() {
  const navigate = useNavigate();
  return (
    <div className="flex flex-col gap-4">
      <h1 className="text-3xl font-extrabold">Start a collection</h1>
      <p>
        It starts empty and you own it. Add animals yourself, restore a backup into it from
        Settings, or invite a partner to own it with you from Settings → People.
      </p>
      <NewCollectionForm onCreated={() => navigate('/today', { replace: true })} />
    </div>
  );
}

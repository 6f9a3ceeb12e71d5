import { useCallback, useState } from 'react';

/** A one-off action from a form: busy while it runs, its error message if it fails. */
export function useAction() {
  const [state, setState] = useState<{ busy: boolean; error: string | null }>({
    busy: false,
    error: null,
  });
  const run = useCallback((work: () => Promise<unknown>) => {
    setState({ busy: true, error: null });
    work().then(
      () => setState({ busy: false, error: null }),
      (err: Error) => setState({ busy: false, error: err.message }),
    );
  }, []);
  return { ...state, run };
}

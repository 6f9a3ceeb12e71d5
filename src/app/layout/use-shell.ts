import { useOutletContext } from 'react-router-dom';
import type { MeResponse, MembershipSummary } from '#shared/schemas/auth';

/** What the signed-in shell hands every screen inside it. */
export interface ShellContext {
  me: MeResponse;
  collection: MembershipSummary | null;
  chooseCollection: (id: string) => void;
}

export function useShell() {
  return useOutletContext<ShellContext>();
}

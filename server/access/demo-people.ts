/** Demo accounts from the demo scenario; the password is shown only in demo mode. */
export const DEMO_PASSWORD = 'northlight-demo';
export const DEMO_ACCOUNTS = [
  { email: 'owner@northlight.test', displayName: 'Robin (owner)', role: 'owner' },
  { email: 'partner@northlight.test', displayName: 'Sam (partner)', role: 'keeper' },
  { email: 'helper@northlight.test', displayName: 'Alex (helper)', role: 'helper' },
] as const;
export const DEMO_COLLECTION = { name: 'Northlight Inverts', timeZone: 'America/Toronto' };

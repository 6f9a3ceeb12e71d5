import 'express-session';

declare module 'express-session' {
  interface SessionData {
    userId?: string;
    /** When this sign-in began (ms since epoch): for the absolute session timeout. */
    signedInAt?: number;
  }
}

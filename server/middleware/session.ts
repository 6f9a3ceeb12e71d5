import type { Request } from 'express';

function regenerate(req: Request) {
  return new Promise<void>((resolve, reject) =>
    req.session.regenerate((err) => (err ? reject(err) : resolve())),
  );
}

/** A fresh session id at every sign-in (OWASP ASVS 4.0.3 3.2.1): no session fixation. */
export async function startSession(req: Request, userId: string) {
  await regenerate(req);
  req.session.userId = userId;
  req.session.signedInAt = Date.now();
}

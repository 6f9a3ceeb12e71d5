/**
 * Request URLs as logged: one-time tokens (invite and reset links) are replaced, never written
 * to logs, and so is the public availability list's link token — whoever holds it reads the
 * list, so a log line must not hand it on. The token is the path segment after
 * `/api/available/` (the JSON and its `/list.csv`) or `/available/` (the page), at the start of
 * the path or of a full URL's path (a Referer); a collection's own `…/sales/available` is not it.
 */
const AVAILABLE_TOKEN = /^((?:[a-z][a-z\d+.-]*:\/\/[^/?#]*)?\/(?:api\/)?available\/)[^/?#]+/i;

export function redactUrl(url: string): string {
  return url
    .replace(/([?&]token=)[^&#]*/gi, '$1[redacted]')
    .replace(AVAILABLE_TOKEN, '$1[redacted]');
}

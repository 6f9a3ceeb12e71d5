/** Request URLs as logged: one-time tokens (invite and reset links) are replaced, never written to logs. */
export function redactUrl(url: string): string {
  return url.replace(/([?&]token=)[^&#]*/gi, '$1[redacted]');
}

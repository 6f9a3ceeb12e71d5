/** Multipart upload of one photo (the one request that is not JSON), with our CSRF header. */
export async function uploadPhoto(path: string, file: File): Promise<void> {
  const form = new FormData();
  form.append('photo', file, file.name.replace(/[/\\]/g, '_') || 'photo.jpg');
  let res: Response;
  try {
    res = await fetch(`/api${path}`, { method: 'PUT', body: form, credentials: 'same-origin', headers: { 'X-Rackside-Client': '1' } });
  } catch {
    throw new Error('No connection to Rackside right now. The photo was not sent.');
  }
  if (!res.ok) throw new Error(((await res.json().catch(() => null)) as { error?: { message?: string } } | null)?.error?.message ?? 'The photo could not be saved.');
}

import { ApiError, apiRequest, type ResponseSchema } from './api-client';

/** One photo as multipart (the one request that is not JSON), answered as `schema` says. */
export async function uploadPhoto<T>(
  path: string,
  file: File,
  schema: ResponseSchema<T>,
): Promise<T> {
  const form = new FormData();
  form.append('photo', file, file.name.replace(/[/\\]/g, '_') || 'photo.jpg');
  try {
    return await apiRequest(path, { method: 'PUT', body: form, schema });
  } catch (err) {
    if (err instanceof ApiError && err.status === 0)
      throw new ApiError(
        0,
        'offline',
        'No connection to Rackside right now. The photo was not sent.',
      );
    throw err;
  }
}

import { useMutation } from '@tanstack/react-query';
import { MAX_RESTORE_BYTES } from '#shared/domain/backup-limits';
import { restoreResponse } from '#shared/schemas/collections';
import { apiRequest } from '@/lib/api-client';

/**
 * A backup file into this (empty) collection. The file goes up as it is, streamed: a phone never
 * holds a large backup in memory, and the server checks it record by record.
 */
export async function restoreBackup(collectionId: string, file: File) {
  if (file.size > MAX_RESTORE_BYTES)
    throw new Error(
      `This backup is larger than Rackside restores (${MAX_RESTORE_BYTES / 1024 / 1024} MB at most).`,
    );
  return apiRequest(`/collections/${collectionId}/restore`, {
    method: 'POST',
    body: file,
    schema: restoreResponse,
  });
}

export const useRestoreBackup = (collectionId: string) =>
  useMutation({ mutationFn: (file: File) => restoreBackup(collectionId, file) });

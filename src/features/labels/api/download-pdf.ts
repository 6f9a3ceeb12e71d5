import type { LabelPdfBody } from '#shared/schemas/labels';
import { apiRaw, failureOf } from '@/lib/api-client';

/** Asks the server for the PDF and hands it to the browser as a download. */
export async function downloadLabelsPdf(collectionId: string, body: LabelPdfBody): Promise<void> {
  const res = await apiRaw(`/collections/${collectionId}/labels/pdf`, {
    method: 'POST',
    body,
    accept: 'application/pdf',
  });
  if (!res.ok) throw await failureOf(res);
  const url = URL.createObjectURL(await res.blob());
  const a = document.createElement('a');
  a.href = url;
  a.download = `rackside-labels-${new Date().toISOString().slice(0, 10)}.pdf`;
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 60_000);
}

import type { LabelPdfBody } from '#shared/schemas/labels';
import { apiDownload } from '@/lib/api-client';

/** Asks the server for the PDF and hands it to the browser as a download. */
export async function downloadLabelsPdf(collectionId: string, body: LabelPdfBody): Promise<void> {
  const blob = await apiDownload(`/collections/${collectionId}/labels/pdf`, { method: 'POST', body }, 'application/pdf');
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = `rackside-labels-${new Date().toISOString().slice(0, 10)}.pdf`;
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 60_000);
}

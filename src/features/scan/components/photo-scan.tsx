import { Html5Qrcode, Html5QrcodeSupportedFormats } from 'html5-qrcode';
import { useId, useState } from 'react';
import { readQrFile } from '../second-reader';

/** Reads a label from a photo: for a phone whose live camera will not start, or a dim corner. */
export function PhotoScan({ onScan }: { onScan: (text: string) => void }) {
  const id = useId();
  const hostId = `photo-${id.replace(/:/g, '')}`;
  const [error, setError] = useState<string | null>(null);
  const read = async (file: File | undefined) => {
    if (!file) return;
    setError(null);
    const qr = new Html5Qrcode(hostId, {
      formatsToSupport: [Html5QrcodeSupportedFormats.QR_CODE],
      verbose: false,
    });
    const text = await qr
      .scanFile(file, false)
      .catch(() => readQrFile(file))
      .finally(() => qr.clear());
    if (text) onScan(text);
    else
      setError(
        'No QR code could be read in that photo. Fill the frame with the label and keep it sharp.',
      );
  };
  return (
    <div className="flex flex-col gap-1">
      <label
        htmlFor={id}
        className="flex min-h-target cursor-pointer items-center justify-center rounded-xl border-2 border-border bg-surface px-4 text-lg font-bold has-[:focus-visible]:outline has-[:focus-visible]:outline-4"
      >
        Scan a photo of a label
        <input
          id={id}
          type="file"
          accept="image/*"
          capture="environment"
          className="sr-only"
          onChange={(e) => {
            void read(e.target.files?.[0]);
            e.target.value = '';
          }}
        />
      </label>
      <div id={hostId} hidden />
      {error && (
        <p role="alert" className="font-bold text-danger">
          {error}
        </p>
      )}
    </div>
  );
}

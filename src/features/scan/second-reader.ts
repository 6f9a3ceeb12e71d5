import jsQR from 'jsqr';

/**
 * A second QR decoder behind html5-qrcode's. The ZXing build bundled in html5-qrcode 2.3.8
 * (TRY_HARDER off, not configurable) misses about 2 % of perfectly printed label symbols: it
 * takes a run in the data area for a finder pattern and gives up. jsQR finds its finder patterns
 * differently and reads those; `second-reader.test.ts` keeps examples of both.
 */
export interface Pixels {
  data: Uint8ClampedArray;
  width: number;
  height: number;
}

export function readQrPixels(pixels: Pixels): string | null {
  return jsQR(pixels.data, pixels.width, pixels.height)?.data ?? null;
}

/** Draws a picture or video frame no larger than `maxSide` into `canvas` and reads it. */
export function readQrImage(
  source: CanvasImageSource,
  width: number,
  height: number,
  canvas: HTMLCanvasElement,
  maxSide: number,
): string | null {
  if (!width || !height) return null;
  const scale = Math.min(1, maxSide / Math.max(width, height));
  canvas.width = Math.round(width * scale);
  canvas.height = Math.round(height * scale);
  const context = canvas.getContext('2d', { willReadFrequently: true });
  if (!context) return null;
  context.drawImage(source, 0, 0, canvas.width, canvas.height);
  return readQrPixels(context.getImageData(0, 0, canvas.width, canvas.height));
}

/** A photo from the file picker: large enough for a label across a room, small enough to be quick. */
export async function readQrFile(file: File): Promise<string | null> {
  const bitmap = await createImageBitmap(file).catch(() => null);
  if (!bitmap) return null;
  try {
    return readQrImage(bitmap, bitmap.width, bitmap.height, document.createElement('canvas'), 1600);
  } finally {
    bitmap.close();
  }
}

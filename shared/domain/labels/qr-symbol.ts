import QRCode from 'qrcode';

/**
 * A QR symbol at error correction level M (ISO/IEC 18004:2015, 5.3.8.1: about 15 % of the
 * codewords can be restored), which survives a scuffed or damp label without growing the
 * symbol much. The encoding (mode, version, masking) is done by the `qrcode` package.
 */
export interface QrSymbol {
  version: number;
  /** Modules per side: 4·version + 17 (ISO/IEC 18004:2015, 5.3.1). */
  size: number;
  /** Row-major, 1 for a dark module. */
  modules: Uint8Array;
}

/** The quiet zone every side needs, in modules (ISO/IEC 18004:2015, 5.3.8 and 9.1). */
export const QUIET_ZONE_MODULES = 4;

export function makeQrSymbol(text: string): QrSymbol {
  const qr = QRCode.create(text, { errorCorrectionLevel: 'M' });
  return { version: qr.version, size: qr.modules.size, modules: qr.modules.data };
}

/**
 * The dark modules as one SVG path in module units (each row's runs merged), so a symbol is a
 * single element in the preview and a single fill in the PDF, drawn at any scale without blur.
 */
export function qrPath(symbol: QrSymbol): string {
  const { size, modules } = symbol;
  const parts: string[] = [];
  for (let y = 0; y < size; y++) {
    let x = 0;
    while (x < size) {
      if (!modules[y * size + x]) {
        x++;
        continue;
      }
      const start = x;
      while (x < size && modules[y * size + x]) x++;
      parts.push(`M${start} ${y}h${x - start}v1h${start - x}z`);
    }
  }
  return parts.join('');
}

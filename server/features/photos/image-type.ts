/**
 * The image type from the file's first bytes, never from its name or the browser's word:
 * JPEG starts FF D8 FF (ISO/IEC 10918-1, SOI marker), PNG with its 8-byte signature
 * (ISO/IEC 15948, 5.2), WebP with "RIFF" … "WEBP" (RFC 9649, 2.5).
 */
export type ImageType = 'jpeg' | 'png' | 'webp';

export function imageTypeOf(bytes: Uint8Array): ImageType | null {
  const starts = (sig: number[], at = 0) => sig.every((b, i) => bytes[at + i] === b);
  if (starts([0xff, 0xd8, 0xff])) return 'jpeg';
  if (starts([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return 'png';
  if (starts([0x52, 0x49, 0x46, 0x46]) && starts([0x57, 0x45, 0x42, 0x50], 8)) return 'webp';
  return null;
}

/** A name with no folder in it: no slashes, no "..", no control characters. */
export function isPlainFileName(name: string): boolean {
  const control = [...name].some((c) => c.charCodeAt(0) < 0x20);
  return (
    name.length > 0 &&
    name.length <= 255 &&
    !control &&
    !/[/\\]/.test(name) &&
    !name.includes('..') &&
    !/^\.+$/.test(name)
  );
}

import { describe, expect, it } from 'vitest';
import { imageTypeOf, isPlainFileName } from './image-type';

describe('photo uploads', () => {
  it('tell the type from the first bytes (JPEG SOI, PNG signature, RIFF/WEBP)', () => {
    expect(imageTypeOf(Uint8Array.from([0xff, 0xd8, 0xff, 0xe0, 0, 0]))).toBe('jpeg');
    expect(imageTypeOf(Uint8Array.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0]))).toBe(
      'png',
    );
    expect(imageTypeOf(Buffer.from('RIFF\x10\x00\x00\x00WEBPVP8 ', 'latin1'))).toBe('webp');
    expect(imageTypeOf(Buffer.from('GIF89a'))).toBeNull();
    expect(imageTypeOf(Buffer.from('%PDF-1.7'))).toBeNull();
    expect(imageTypeOf(new Uint8Array())).toBeNull();
  });

  it('refuse names that reach into folders', () => {
    expect(isPlainFileName('IMG_2041.jpg')).toBe(true);
    expect(isPlainFileName('Juniper – molt.jpeg')).toBe(true);
    for (const bad of [
      '../../etc/passwd',
      '..\\boot.ini',
      'a/b.jpg',
      '..',
      '.',
      '',
      'x\0.jpg',
      'photo..jpg',
    ])
      expect(isPlainFileName(bad), bad).toBe(false);
  });
});

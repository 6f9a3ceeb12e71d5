/** Length of a string in UTF-8 bytes — bcrypt reads bytes, not characters. */
export function utf8ByteLength(value: string): number {
  return new TextEncoder().encode(value).length;
}

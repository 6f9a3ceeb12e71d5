import type { IncomingMessage } from 'node:http';
import { describe, expect, it } from 'vitest';
import { fromLoopback, isLoopbackAddress } from './loopback';

const request = (remoteAddress: string, headers: Record<string, string> = {}) =>
  ({ socket: { remoteAddress }, headers }) as unknown as IncomingMessage;

describe('loopback clients', () => {
  it('knows loopback addresses (RFC 1122 3.2.1.3, RFC 4291 2.5.3 and 2.5.5.2)', () => {
    for (const a of [
      '127.0.0.1',
      '127.9.8.7',
      '::1',
      '::ffff:127.0.0.1',
      '0:0:0:0:0:0:0:1',
      '[::1]',
    ])
      expect(isLoopbackAddress(a), a).toBe(true);
    for (const a of [
      '10.231.0.2',
      '192.168.1.20',
      '::ffff:192.168.1.20',
      'fe80::1',
      '::',
      '128.0.0.1',
      'localhost',
      '',
      undefined,
    ])
      expect(isLoopbackAddress(a), String(a)).toBe(false);
  });

  it('refuses a request a local proxy forwarded for another host', () => {
    expect(fromLoopback(request('127.0.0.1'))).toBe(true);
    expect(fromLoopback(request('192.168.1.20'))).toBe(false);
    expect(fromLoopback(request('127.0.0.1', { 'x-forwarded-for': '192.168.1.20' }))).toBe(false);
    expect(
      fromLoopback(request('127.0.0.1', { 'x-forwarded-for': '127.0.0.1, 192.168.1.20' })),
    ).toBe(false);
    expect(
      fromLoopback(request('127.0.0.1', { forwarded: 'for="[2001:db8::1]:47011";proto=https' })),
    ).toBe(false);
    expect(fromLoopback(request('127.0.0.1', { forwarded: 'for=_hidden' }))).toBe(false);
    expect(fromLoopback(request('127.0.0.1', { 'x-real-ip': '10.0.0.9' }))).toBe(false);
    expect(
      fromLoopback(request('::1', { 'x-forwarded-for': '::1', forwarded: 'for=127.0.0.1:5173' })),
    ).toBe(true);
  });
});

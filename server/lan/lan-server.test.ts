import os from 'node:os';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { readEnv } from '../env';
import { loadLan } from './lan-server';

afterEach(() => vi.restoreAllMocks());

describe('LAN mode facts at start', () => {
  it('never lists network interfaces when serving on loopback', () => {
    // Under the systemd unit (RestrictAddressFamilies without AF_NETLINK) listing interfaces
    // throws "uv_interface_addresses returned Unknown system error 97"; a plain start must not try.
    const listing = vi.spyOn(os, 'networkInterfaces').mockImplementation(() => {
      throw new Error('uv_interface_addresses returned Unknown system error 97');
    });
    const env = readEnv({
      NODE_ENV: 'development',
      DATABASE_URL: 'postgres://localhost/x',
      SESSION_SECRET: 'a-development-secret-long-enough-for-sessions',
    });
    expect(loadLan(env)).toBeUndefined();
    expect(listing).not.toHaveBeenCalled();
  });
});

import type { NetworkInterfaceInfo } from 'node:os';
import { describe, expect, it } from 'vitest';
import { canonicalIp, certificateNames, lanAddresses, lanUrl } from './addresses';

const v4 = (address: string, internal = false) =>
  ({
    address,
    family: 'IPv4',
    internal,
    netmask: '255.255.255.0',
    mac: '',
    cidr: null,
  }) as NetworkInterfaceInfo;
const v6 = (address: string, scopeid = 0) =>
  ({
    address,
    family: 'IPv6',
    internal: false,
    netmask: 'ffff:ffff:ffff:ffff::',
    mac: '',
    cidr: null,
    scopeid,
  }) as NetworkInterfaceInfo;

describe("this machine's addresses for the --lan certificate", () => {
  it('lists IPv4 before IPv6, real interfaces before bridges, and leaves out loopback and link-local', () => {
    const found = lanAddresses({
      lo: [v4('127.0.0.1', true), { ...v6('::1'), internal: true }],
      docker0: [v4('172.17.0.1')],
      wlan0: [v6('fe80::1c2d:3eff:fe4f:5a6b', 3), v6('2001:DB8:0:0:0:0:0:20'), v4('192.168.1.20')],
      eth0: [v4('10.0.0.5'), v6('fd12:3456::5')],
    });
    expect(found).toEqual([
      '192.168.1.20',
      '10.0.0.5',
      '172.17.0.1',
      '2001:db8::20',
      'fd12:3456::5',
    ]);
  });

  it('names localhost, the host and its .local name, loopback and every address', () => {
    expect(certificateNames(['192.168.1.20', 'FD12:3456:0::5'], 'Keeper-PC.home')).toEqual({
      dns: ['localhost', 'keeper-pc.home', 'keeper-pc.local'],
      ips: ['127.0.0.1', '::1', '192.168.1.20', 'fd12:3456::5'],
    });
    // A host name that is no DNS name is left out rather than breaking the certificate.
    expect(certificateNames([], 'my pc_1').dns).toEqual(['localhost']);
  });

  it('writes IPv6 the one way URLs do', () => {
    expect(canonicalIp('FD00:0:0:0:0:0:0:1')).toBe('fd00::1');
    expect(canonicalIp('::ffff:192.168.1.2')).toBe('::ffff:c0a8:102');
    expect(canonicalIp('192.168.001.002')).toBe('192.168.1.2');
  });

  it('puts the first LAN address in the link phones open', () => {
    expect(lanUrl(['192.168.1.20', '10.0.0.5'], 'pc', 3000)).toBe('https://192.168.1.20:3000');
    expect(lanUrl(['fd12::5'], 'pc', 3000)).toBe('https://[fd12::5]:3000');
    expect(lanUrl([], 'Keeper-PC.home', 8443)).toBe('https://keeper-pc.local:8443');
  });
});

// Which names and addresses a phone on the home network may use to reach this machine, for the
// `--lan` certificate (docs/decisions/017-home-network-https.md). Pure over its inputs: the
// caller passes os.networkInterfaces() and os.hostname().
import type { NetworkInterfaceInfo } from 'node:os';

export type Interfaces = NodeJS.Dict<NetworkInterfaceInfo[]>;

// Bridges that containers and virtual machines make: their addresses go in the certificate,
// but a phone cannot reach them, so they are never the address shown first.
const VIRTUAL = /^(docker|br-|veth|virbr|vmnet|vboxnet|cni|flannel|podman|lxc|lxd)/;

/** The same address written the same way (`FD00:0:0::1` → `fd00::1`), as URLs write it. */
export function canonicalIp(ip: string): string {
  const v6 = ip.includes(':');
  const host = new URL(`http://${v6 ? `[${ip}]` : ip}/`).hostname;
  return v6 ? host.slice(1, -1) : host;
}

/**
 * The machine's addresses on its networks: IPv4 first (what a phone is likeliest to reach),
 * real interfaces before virtual bridges, then IPv6. Loopback is left out (it is always in the
 * certificate anyway), and so are IPv6 link-local addresses (fe80::/10): they need an
 * interface name (`%wlan0`) that a phone's browser cannot take in an address.
 */
export function lanAddresses(interfaces: Interfaces): string[] {
  const found: { ip: string; v6: boolean; virtual: boolean }[] = [];
  for (const [name, infos] of Object.entries(interfaces)) {
    for (const info of infos ?? []) {
      if (info.internal) continue;
      const v6 = info.family === 'IPv6';
      const ip = canonicalIp(info.address.split('%')[0]!);
      if (v6 && /^fe[89ab]/i.test(ip)) continue;
      found.push({ ip, v6, virtual: VIRTUAL.test(name) });
    }
  }
  const rank = (a: (typeof found)[number]) => (a.v6 ? 2 : 0) + (a.virtual ? 1 : 0);
  return [...new Set(found.sort((a, b) => rank(a) - rank(b)).map((a) => a.ip))];
}

export interface CertificateNames {
  /** DNS names, lower case. */
  dns: string[];
  /** IP addresses, canonical (canonicalIp). */
  ips: string[];
}

const DNS_NAME =
  /^(?=.{1,253}$)([a-z0-9]([a-z0-9-]{0,61}[a-z0-9])?)(\.[a-z0-9]([a-z0-9-]{0,61}[a-z0-9])?)*$/;

/**
 * Everything the certificate must name: localhost and the loopback addresses, the host name
 * and its multicast-DNS name (`<name>.local`, which many home networks resolve), and each
 * address of `lanAddresses`.
 */
export function certificateNames(addresses: string[], hostname: string): CertificateNames {
  const host = hostname.trim().toLowerCase().replace(/\.$/, '');
  const short = host.split('.')[0] ?? '';
  const dns = ['localhost', host, short && `${short}.local`].filter(
    (n): n is string => !!n && DNS_NAME.test(n),
  );
  return {
    dns: [...new Set(dns)],
    ips: [...new Set(['127.0.0.1', '::1', ...addresses].map(canonicalIp))],
  };
}

/** The address to show and to put in links: the first LAN address, else `<host>.local`. */
export function lanUrl(addresses: string[], hostname: string, port: number): string {
  const first = addresses[0];
  if (first) return `https://${first.includes(':') ? `[${first}]` : first}:${port}`;
  const short = hostname.trim().toLowerCase().split('.')[0];
  return `https://${short && DNS_NAME.test(short) ? `${short}.local` : 'localhost'}:${port}`;
}

// `npm start -- --lan`: where the home-network certificate lives and what the server is told
// (docs/decisions/017-home-network-https.md). Plain Node, like the rest of scripts/lib.
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

/** The certificate files `scripts/lan-certificate.ts` keeps (keys readable by this user only). */
export function lanFiles(dir = path.join(root, '.data', 'lan')) {
  return {
    dir,
    caCert: path.join(dir, 'home-ca.crt'),
    caKey: path.join(dir, 'home-ca.key'),
    cert: path.join(dir, 'server.crt'),
    key: path.join(dir, 'server.key'),
  };
}

/**
 * The server's environment for LAN mode: HTTPS with the made certificate, on every address
 * (HOST 0.0.0.0) unless HOST says otherwise. Without `--lan` none of this is set and the server
 * listens on 127.0.0.1 only (server/env.ts).
 */
export function lanEnv(base, files = lanFiles()) {
  return {
    LAN_MODE: 'true',
    HOST: base.HOST || '0.0.0.0',
    HTTPS_CERT_FILE: files.cert,
    HTTPS_KEY_FILE: files.key,
    HTTPS_CA_FILE: files.caCert,
  };
}

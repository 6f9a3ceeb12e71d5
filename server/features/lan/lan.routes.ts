import { Router } from 'express';
import { LAN_CERTIFICATE_FILE_NAME, type LanStatusResponse } from '#shared/schemas/lan';
import type { LanInfo } from '../../lan/lan-server';

/**
 * `GET /api/lan`, for anyone: whether the server runs in LAN mode, and then its address and
 * certificate fingerprints (what the terminal prints too). `GET /api/lan/certificate` exists
 * only in LAN mode: the certificate a phone installs. Both are public facts — a certificate is
 * sent to every visitor anyway — and a phone may need them before anyone can sign in on it.
 */
export function lanRoutes(lan: LanInfo | undefined) {
  const router = Router();
  router.get('/', (_req, res) => {
    const body: LanStatusResponse = lan
      ? {
          lanMode: true,
          url: lan.url,
          caFingerprint: lan.caFingerprint,
          serverFingerprint: lan.serverFingerprint,
        }
      : { lanMode: false };
    res.json(body);
  });
  if (!lan) return router;
  router.get('/certificate', (_req, res) => {
    // The type Android and iOS open as "install a certificate" (RFC 2585 names
    // application/pkix-cert for DER; x-x509-ca-cert is the long-standing one browsers hand to
    // the system's installer, PEM or DER — common practice, from memory).
    res
      .type('application/x-x509-ca-cert')
      .attachment(LAN_CERTIFICATE_FILE_NAME)
      .set('Cache-Control', 'no-store')
      .send(lan.caPem);
  });
  return router;
}

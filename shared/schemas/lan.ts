import { z } from 'zod';

/**
 * `GET /api/lan`: whether this server runs in LAN mode (`npm start -- --lan`), and then the
 * address phones use and the fingerprints to compare on the phone.
 */
export const lanStatusResponse = z.discriminatedUnion('lanMode', [
  z.object({ lanMode: z.literal(false) }),
  z.object({
    lanMode: z.literal(true),
    url: z.string().url(),
    /** SHA-256 of the certificate to install on the phone (the home authority), `AB:CD:…`. */
    caFingerprint: z.string(),
    /** SHA-256 of the certificate the server presents, as a browser's page info shows it. */
    serverFingerprint: z.string(),
  }),
]);
export type LanStatusResponse = z.infer<typeof lanStatusResponse>;

/** Where the certificate to install is downloaded from, in LAN mode only. */
export const LAN_CERTIFICATE_PATH = '/api/lan/certificate';
export const LAN_CERTIFICATE_FILE_NAME = 'rackside-home-authority.crt';

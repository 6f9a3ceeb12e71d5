export interface LanFiles {
  dir: string;
  caCert: string;
  caKey: string;
  cert: string;
  key: string;
}
export function lanFiles(dir?: string): LanFiles;
export function lanEnv(
  base: Record<string, string | undefined>,
  files?: LanFiles,
): {
  LAN_MODE: 'true';
  HOST: string;
  HTTPS_CERT_FILE: string;
  HTTPS_KEY_FILE: string;
  HTTPS_CA_FILE: string;
};

import { useMemo } from 'react';
import { makeQrSymbol, QUIET_ZONE_MODULES, qrPath } from '#shared/domain/labels/qr-symbol';
import { LAN_CERTIFICATE_FILE_NAME, LAN_CERTIFICATE_PATH } from '#shared/schemas/lan';
import { useLanStatus } from '../api/lan-status';

const linkClass =
  'flex min-h-target items-center justify-between gap-2 rounded-xl border-2 border-border bg-surface px-3 font-bold';
const detailsClass = 'rounded-xl border-2 border-border bg-surface px-3';
const summaryClass = 'flex min-h-target cursor-pointer items-center font-bold';

const LOOPBACK = /^(localhost|127\.\d+\.\d+\.\d+|\[::1\])$/;

/** The address as a QR code, dark on white whatever the theme (a camera needs the contrast). */
function AddressQr({ url }: { url: string }) {
  const symbol = useMemo(() => makeQrSymbol(url), [url]);
  const side = symbol.size + 2 * QUIET_ZONE_MODULES;
  return (
    <svg
      role="img"
      aria-label={`QR code of ${url}`}
      viewBox={`${-QUIET_ZONE_MODULES} ${-QUIET_ZONE_MODULES} ${side} ${side}`}
      shapeRendering="crispEdges"
      className="h-52 w-52 self-center rounded-lg"
    >
      <rect
        x={-QUIET_ZONE_MODULES}
        y={-QUIET_ZONE_MODULES}
        width={side}
        height={side}
        fill="#fff"
      />
      <path d={qrPath(symbol)} fill="#000" />
    </svg>
  );
}

/**
 * "Use Rackside on your phone": in LAN mode (`npm start -- --lan`), the address to open, the
 * certificate to trust and how (docs/decisions/017-home-network-https.md). Outside LAN mode it
 * says how to start it, on the computer running the server only.
 */
export function PhoneSetup() {
  const lan = useLanStatus();
  if (!lan.data) return null;
  if (!lan.data.lanMode) {
    if (!LOOPBACK.test(window.location.hostname)) return null;
    return (
      <section aria-labelledby="phone-heading" className="flex flex-col gap-2">
        <h2 id="phone-heading" className="text-xl font-extrabold">
          Use Rackside on your phone
        </h2>
        <p>
          Phones open their camera for scanning only over HTTPS. To use Rackside from phones on your
          home network, stop it and start it again with{' '}
          <code className="font-bold">npm start -- --lan</code>.
        </p>
      </section>
    );
  }
  const { url, caFingerprint } = lan.data;
  return (
    <section aria-labelledby="phone-heading" className="flex flex-col gap-3">
      <h2 id="phone-heading" className="text-xl font-extrabold">
        Use Rackside on your phone
      </h2>
      <p>On a phone on the same Wi-Fi, scan this code with the camera or type the address:</p>
      <AddressQr url={url} />
      <p className="break-all text-center text-lg font-bold">{url}</p>
      <p>
        This computer made its own certificate for that address. Until the phone trusts it, the
        browser warns that the connection is not private. Trust it once on each phone:
      </p>
      <a className={linkClass} href={LAN_CERTIFICATE_PATH} download={LAN_CERTIFICATE_FILE_NAME}>
        Download this computer&apos;s certificate <span aria-hidden="true">↓</span>
      </a>
      <p className="text-sm">
        Its fingerprint (SHA-256), which the phone shows among the certificate&apos;s details and
        the terminal printed when Rackside started — they must match:
      </p>
      <p className="font-mono text-sm">
        {/* Lines break between pairs, never inside one. */}
        {caFingerprint.split(':').map((pair, i) => (
          <span key={i}>
            {i > 0 && ':'}
            {i > 0 && <wbr />}
            {pair}
          </span>
        ))}
      </p>
      {/* The steps below are written from memory of recent Android and iOS versions, not
          checked against either maker's documentation. */}
      <details className={detailsClass}>
        <summary className={summaryClass}>On Android</summary>
        <ol className="flex list-decimal flex-col gap-2 pb-3 pl-5">
          <li>
            Open the address above in Chrome. At the warning, choose Advanced, then continue to the
            address.
          </li>
          <li>Download the certificate with the button above.</li>
          <li>
            Open the phone&apos;s Settings, then Security (sometimes Security &amp; privacy, then
            More security settings), then Encryption &amp; credentials.
          </li>
          <li>
            Choose Install a certificate, then CA certificate, accept the warning, and pick{' '}
            <span className="break-all font-bold">{LAN_CERTIFICATE_FILE_NAME}</span> from Downloads.
          </li>
          <li>Close Chrome&apos;s tab and open the address again: the warning is gone.</li>
        </ol>
      </details>
      <details className={detailsClass}>
        <summary className={summaryClass}>On iPhone or iPad</summary>
        <ol className="flex list-decimal flex-col gap-2 pb-3 pl-5">
          <li>
            Open the address above in Safari (other browsers cannot install it). At the warning,
            choose Show Details, then visit the website.
          </li>
          <li>Download the certificate with the button above and allow the profile download.</li>
          <li>
            Open Settings, then General, then VPN &amp; Device Management. Choose the Rackside home
            authority profile and install it.
          </li>
          <li>
            Then open Settings, General, About, Certificate Trust Settings, and switch on full trust
            for the Rackside home authority.
          </li>
          <li>Open the address in Safari again: the warning is gone.</li>
        </ol>
      </details>
      <p className="text-sm text-muted">
        The menus are named a little differently from one phone maker and version to the next: look
        for the nearest words. Trust only the certificate from your own computer, and remove it from
        the phone when you stop using Rackside at home: whoever had this computer&apos;s files could
        use it to pose as other websites to that phone.
      </p>
    </section>
  );
}

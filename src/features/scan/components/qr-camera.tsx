import { Html5Qrcode, Html5QrcodeScannerState, Html5QrcodeSupportedFormats } from 'html5-qrcode';
import { useEffect, useId, useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { readQrImage } from '../second-reader';

type CameraState =
  'starting' | 'scanning' | 'paused' | 'denied' | 'no_camera' | 'busy' | 'unsupported' | 'failed';

/** html5-qrcode passes getUserMedia's DOMException on as text; its name says what went wrong. */
export function cameraProblem(error: unknown): CameraState {
  const text = String(error);
  if (/NotAllowedError|SecurityError|Permission/i.test(text)) return 'denied';
  if (/NotFoundError|OverconstrainedError|DevicesNotFound|Requested device not found/i.test(text))
    return 'no_camera';
  if (/NotReadableError|TrackStartError|AbortError|Could not start video/i.test(text))
    return 'busy';
  if (/not supported|streaming/i.test(text)) return 'unsupported';
  return 'failed';
}

const HELP: Partial<Record<CameraState, { title: string; body: string }>> = {
  denied: {
    title: 'Rackside may not use the camera.',
    body: 'Allow the camera for this site in the browser’s site settings (the icon beside the address), then tap “Try again”. You can type the code below meanwhile.',
  },
  no_camera: {
    title: 'No camera was found.',
    body: 'Type the code from the label below, or scan a photo of it.',
  },
  busy: {
    title: 'The camera is in use by another app.',
    body: 'Close the other app that uses the camera, then tap “Try again”.',
  },
  unsupported: {
    title: 'This browser cannot use the camera here.',
    body: 'Cameras work over https (or on this computer itself). Type the code below instead.',
  },
  failed: {
    title: 'The camera could not start.',
    body: 'Tap “Try again”, or type the code below.',
  },
};

/** The same label still in view after a tap must not open again until the camera has lost it. */
const SAME_LABEL_GAP_MS = 1500;
/** How often the second reader looks at a frame: twice a second costs a phone little. */
const SECOND_READER_MS = 500;

interface Props {
  /** False while an item is open: the preview freezes and nothing is decoded. */
  active: boolean;
  onScan: (text: string) => void;
}

/**
 * The rear camera decoding QR codes only. It stops when the page is hidden (battery, and the
 * camera light goes off) and starts again when the page is back.
 */
export function QrCamera({ active, onScan }: Props) {
  const hostId = `camera-${useId().replace(/:/g, '')}`;
  const scanner = useRef<Html5Qrcode | null>(null);
  const last = useRef({ text: '', seenAt: 0 });
  const onScanRef = useRef(onScan);
  useEffect(() => {
    onScanRef.current = onScan;
  }, [onScan]);
  const activeRef = useRef(active);
  const [state, setState] = useState<CameraState>('starting');
  const [torch, setTorch] = useState<{ supported: boolean; on: boolean }>({
    supported: false,
    on: false,
  });
  const [attempt, setAttempt] = useState(0);

  useEffect(() => {
    const seen = (text: string) => {
      const now = Date.now();
      const seenBefore =
        text === last.current.text && now - last.current.seenAt < SAME_LABEL_GAP_MS;
      last.current = { text, seenAt: now };
      if (!seenBefore && activeRef.current) onScanRef.current(text);
    };
    const qr = new Html5Qrcode(hostId, {
      formatsToSupport: [Html5QrcodeSupportedFormats.QR_CODE],
      verbose: false,
    });
    scanner.current = qr;
    let disposed = false;
    const isRunning = () =>
      [Html5QrcodeScannerState.SCANNING, Html5QrcodeScannerState.PAUSED].includes(qr.getState());

    const start = async () => {
      setState('starting');
      try {
        await qr.start(
          { facingMode: 'environment' },
          {
            fps: 10,
            qrbox: (w, h) => ({
              width: Math.floor(Math.min(w, h) * 0.75),
              height: Math.floor(Math.min(w, h) * 0.75),
            }),
          },
          seen,
          () => undefined,
        );
        if (disposed) return void qr.stop().catch(() => undefined);
        if (!activeRef.current) qr.pause(true);
        setState(activeRef.current ? 'scanning' : 'paused');
        try {
          setTorch({
            supported: qr.getRunningTrackCameraCapabilities().torchFeature().isSupported(),
            on: false,
          });
        } catch {
          setTorch({ supported: false, on: false });
        }
      } catch (err) {
        if (!disposed) setState(cameraProblem(err));
      }
    };
    const stop = async () => {
      if (isRunning()) await qr.stop().catch(() => undefined);
    };
    const onVisibility = () => void (document.hidden ? stop() : start());

    // The second reader (see second-reader.ts) on the same video html5-qrcode shows.
    const canvas = document.createElement('canvas');
    const second = window.setInterval(() => {
      const video = document.getElementById(hostId)?.querySelector('video');
      if (!video || !activeRef.current || qr.getState() !== Html5QrcodeScannerState.SCANNING)
        return;
      const text = readQrImage(video, video.videoWidth, video.videoHeight, canvas, 640);
      if (text) seen(text);
    }, SECOND_READER_MS);

    void start();
    document.addEventListener('visibilitychange', onVisibility);
    return () => {
      disposed = true;
      window.clearInterval(second);
      document.removeEventListener('visibilitychange', onVisibility);
      scanner.current = null;
      void stop().then(() => qr.clear());
    };
  }, [hostId, attempt]);

  useEffect(() => {
    activeRef.current = active;
    const qr = scanner.current;
    if (!qr) return;
    const current = qr.getState();
    if (active && current === Html5QrcodeScannerState.PAUSED) {
      // The label just handled is probably still in view: treat it as seen now.
      last.current = { ...last.current, seenAt: Date.now() };
      qr.resume();
      setState('scanning');
    } else if (!active && current === Html5QrcodeScannerState.SCANNING) {
      qr.pause(true);
      setState('paused');
    }
  }, [active]);

  const toggleTorch = async () => {
    const next = !torch.on;
    try {
      await scanner.current?.getRunningTrackCameraCapabilities().torchFeature().apply(next);
      setTorch({ supported: true, on: next });
    } catch {
      setTorch({ supported: false, on: false });
    }
  };

  const help = HELP[state];
  return (
    <div className="flex flex-col gap-2">
      {/* html5-qrcode sizes the video to this box and shades all but the part it decodes. */}
      <div
        className={`relative mx-auto min-h-48 w-full max-w-sm overflow-hidden rounded-2xl border-2 border-border bg-black ${help ? 'hidden' : ''}`}
      >
        <div id={hostId} className="w-full" />
        {state === 'starting' && (
          <p className="absolute inset-0 grid place-items-center font-bold text-white">
            Starting the camera…
          </p>
        )}
      </div>
      <p className="sr-only" aria-live="polite">
        {state === 'scanning'
          ? 'Camera on. Point it at a label.'
          : state === 'starting'
            ? 'Starting the camera.'
            : ''}
      </p>
      {help && (
        <Notice tone="warning" title={help.title}>
          <p>{help.body}</p>
          <Button variant="secondary" className="mt-2" onClick={() => setAttempt((n) => n + 1)}>
            Try again
          </Button>
        </Notice>
      )}
      {torch.supported && !help && (
        <Button variant="secondary" aria-pressed={torch.on} onClick={() => void toggleTorch()}>
          {torch.on ? 'Torch off' : 'Torch on'}
        </Button>
      )}
    </div>
  );
}

'use client';
import { useEffect, useEffectEvent, useRef, useState, useSyncExternalStore } from 'react';
import { Camera } from 'lucide-react';

// The Barcode Detection API (Chromium on Android and desktop); not in TypeScript's DOM types yet.
type Detected = { rawValue: string };
type Detector = { detect: (source: HTMLVideoElement) => Promise<Detected[]> };
type DetectorClass = new (opts?: { formats?: string[] }) => Detector;

function detectorClass(): DetectorClass | null {
  if (typeof window === 'undefined') return null;
  return (window as unknown as { BarcodeDetector?: DetectorClass }).BarcodeDetector ?? null;
}

/**
 * Camera scanning where the browser can read barcodes itself; elsewhere nothing is shown and the
 * scanner input (keyboard wedge or typing) is the way in. The same code is not sent twice within 3 s.
 */
const noSubscription = () => () => {};
const cameraScanSupported = () => Boolean(detectorClass()) && Boolean(navigator.mediaDevices?.getUserMedia);

export function CameraScan({ onCode }: { onCode: (code: string) => void }) {
  const supported = useSyncExternalStore(noSubscription, cameraScanSupported, () => false);
  const [on, setOn] = useState(false);
  const [error, setError] = useState<string>();
  const video = useRef<HTMLVideoElement>(null);
  const last = useRef<{ code: string; at: number }>({ code: '', at: 0 });
  const send = useEffectEvent(onCode);

  useEffect(() => {
    if (!on) return;
    const Det = detectorClass();
    if (!Det) return;
    let stream: MediaStream | null = null;
    let timer: ReturnType<typeof setInterval> | undefined;
    let stopped = false;
    const detector = new Det({ formats: ['code_128', 'qr_code', 'data_matrix', 'code_39', 'ean_13'] });
    navigator.mediaDevices
      .getUserMedia({ video: { facingMode: 'environment' }, audio: false })
      .then(async (s) => {
        if (stopped) {
          s.getTracks().forEach((t) => t.stop());
          return;
        }
        stream = s;
        if (!video.current) return;
        video.current.srcObject = s;
        await video.current.play();
        timer = setInterval(async () => {
          if (!video.current || video.current.readyState < 2) return;
          try {
            for (const d of await detector.detect(video.current)) {
              const code = d.rawValue.trim();
              const now = Date.now();
              if (!code || (code === last.current.code && now - last.current.at < 3000)) continue;
              last.current = { code, at: now };
              send(code);
            }
          } catch {
            /* a frame that could not be read */
          }
        }, 300);
      })
      .catch(() => {
        setError('The camera could not be opened. Allow camera access, or use the scanner input.');
        setOn(false);
      });
    return () => {
      stopped = true;
      if (timer) clearInterval(timer);
      stream?.getTracks().forEach((t) => t.stop());
    };
  }, [on]);

  if (!supported) return null;
  return (
    <div className="space-y-2">
      <button type="button" className="btn-quiet" onClick={() => setOn((v) => !v)} aria-pressed={on}>
        <Camera aria-hidden className="h-4 w-4" /> {on ? 'Stop the camera' : 'Scan with the camera'}
      </button>
      {on ? (
        <video
          ref={video}
          className="w-full max-w-sm rounded-lg border border-line"
          muted
          playsInline
          aria-label="Camera view for scanning super tags"
        />
      ) : null}
      {error ? (
        <p className="field-error" role="alert">
          {error}
        </p>
      ) : null}
    </div>
  );
}

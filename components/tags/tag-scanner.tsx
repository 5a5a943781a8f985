'use client';

import { Camera, CameraOff, Flashlight, FlashlightOff, ScanLine } from 'lucide-react';
import { useCallback, useEffect, useRef, useState } from 'react';
import type { IScannerControls } from '@zxing/browser';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { CodeEntry } from '@/components/tags/code-entry';
import { codeFromScan, formatCode } from '@/lib/tags/code';
import { cn } from '@/lib/utils';

type CameraState = 'starting' | 'running' | 'denied' | 'unavailable' | 'stopped';

/**
 * A tag scanner: rear camera through @zxing/browser, torch where the device has one, and typed
 * entry. It hands each code read to `onCode` (the Scan page opens it; a visit switches unit).
 */
export function TagScanner({ onCode, compact = false }: { onCode: (code: string, via: 'camera' | 'typed') => void; compact?: boolean }) {
  const video = useRef<HTMLVideoElement>(null);
  const controls = useRef<IScannerControls | null>(null);
  const handled = useRef(false);
  // Counts camera starts, so a start that finishes after a stop or a newer start lets go of its camera.
  const attempts = useRef(0);
  const [state, setState] = useState<CameraState>('starting');
  const [torch, setTorch] = useState<{ supported: boolean; on: boolean }>({ supported: false, on: false });
  const [foreign, setForeign] = useState<string | null>(null);
  const [opening, setOpening] = useState<string | null>(null);

  const open = useCallback(
    (code: string, via: 'camera' | 'typed') => {
      setOpening(code);
      onCode(code, via);
    },
    [onCode],
  );

  const stop = useCallback(() => {
    attempts.current++;
    controls.current?.stop();
    controls.current = null;
  }, []);

  const start = useCallback(async () => {
    if (!video.current) return;
    stop();
    handled.current = false;
    setState('starting');
    setForeign(null);
    if (!navigator.mediaDevices?.getUserMedia) {
      setState('unavailable');
      return;
    }
    const attempt = ++attempts.current;
    let stream: MediaStream | null = null;
    try {
      stream = await navigator.mediaDevices.getUserMedia({ audio: false, video: { facingMode: { ideal: 'environment' } } });
      // The decoder (the largest script of the page) is fetched only once a camera is running, so
      // a phone without one, or with the camera blocked, never downloads it.
      const { TagQrReader } = await import('@/components/tags/qr-reader');
      // Stopped or started again meanwhile: this camera is no longer wanted.
      if (attempt !== attempts.current || !video.current) {
        stream.getTracks().forEach((t) => t.stop());
        return;
      }
      const reader = new TagQrReader(undefined, { delayBetweenScanAttempts: 100 });
      const c = await reader.decodeFromStream(stream, video.current, (result) => {
        if (!result || handled.current) return;
        const code = codeFromScan(result.getText());
        if (!code) {
          setForeign(result.getText().slice(0, 120));
          return;
        }
        handled.current = true;
        controls.current?.stop();
        open(code, 'camera');
      });
      if (attempt !== attempts.current) {
        c.stop();
        return;
      }
      controls.current = c;
      setTorch({ supported: typeof c.switchTorch === 'function', on: false });
      setState('running');
    } catch (error) {
      stream?.getTracks().forEach((t) => t.stop());
      if (attempt !== attempts.current) return;
      const name = (error as { name?: string })?.name;
      setState(name === 'NotAllowedError' || name === 'SecurityError' ? 'denied' : 'unavailable');
    }
  }, [open, stop]);

  useEffect(() => {
    void start();
    return stop;
  }, [start, stop]);

  async function toggleTorch() {
    const c = controls.current;
    if (!c?.switchTorch) return;
    await c.switchTorch(!torch.on);
    setTorch((t) => ({ ...t, on: !t.on }));
  }

  return (
    <div className="space-y-5">
      {opening ? (
        <Alert tone="success" title={`Tag ${formatCode(opening)} read`} />
      ) : null}
      <section aria-labelledby="camera-h" className="space-y-3">
        <h2 id="camera-h" className="sr-only">
          Camera
        </h2>
        <div
          className={cn(
            'relative mx-auto w-full max-w-md overflow-hidden rounded-lg bg-slate-900',
            // Without a picture the box shrinks, so typed entry is in reach without scrolling.
            state === 'running' || state === 'starting' ? (compact ? 'aspect-square max-h-72' : 'aspect-[3/4] sm:aspect-video') : 'h-24',
          )}
        >
          <video ref={video} muted playsInline className="size-full object-cover" data-testid="scan-video" />
          {state === 'running' ? (
            <div aria-hidden className="pointer-events-none absolute inset-[18%] rounded-lg border-4 border-ice-300/80" />
          ) : null}
          <p role="status" className="absolute inset-x-0 bottom-0 flex items-center justify-center gap-2 bg-slate-900/80 px-3 py-2 text-center text-base font-semibold text-white">
            {state === 'starting' ? (
              <>
                <Camera aria-hidden className="size-5" /> Starting the camera…
              </>
            ) : state === 'running' ? (
              <>
                <ScanLine aria-hidden className="size-5" /> Point at the QR symbol on the tag
              </>
            ) : state === 'denied' ? (
              <>
                <CameraOff aria-hidden className="size-5" /> Camera blocked: allow it in the browser, or type the code
              </>
            ) : state === 'unavailable' ? (
              <>
                <CameraOff aria-hidden className="size-5" /> No camera here: type the code below
              </>
            ) : (
              <>
                <CameraOff aria-hidden className="size-5" /> Camera off
              </>
            )}
          </p>
        </div>
        <div className="mx-auto flex max-w-md flex-wrap justify-center gap-2">
          {torch.supported ? (
            <Button variant="secondary" size="lg" className="min-h-14 flex-1" aria-pressed={torch.on} onClick={() => void toggleTorch()}>
              {torch.on ? <FlashlightOff aria-hidden className="size-6" /> : <Flashlight aria-hidden className="size-6" />}
              {torch.on ? 'Torch off' : 'Torch on'}
            </Button>
          ) : null}
          {state === 'running' ? (
            <Button
              variant="secondary"
              size="lg"
              className="min-h-14 flex-1"
              onClick={() => {
                stop();
                setState('stopped');
              }}
            >
              <CameraOff aria-hidden className="size-6" /> Stop camera
            </Button>
          ) : state !== 'starting' ? (
            <Button size="lg" className="min-h-14 flex-1" onClick={() => void start()}>
              <Camera aria-hidden className="size-6" /> Start camera
            </Button>
          ) : null}
        </div>
        {foreign ? (
          <Alert tone="warning" title="That QR symbol is not one of our tags." className="mx-auto max-w-md">
            It reads “{foreign}”. Point at the tag&apos;s own symbol, or type the code under it.
          </Alert>
        ) : null}
      </section>
      <section aria-labelledby="manual-h" className="mx-auto max-w-md space-y-2 rounded-lg border border-slate-200 bg-white p-4">
        <h2 id="manual-h" className="text-lg font-semibold">
          Type the code instead
        </h2>
        <CodeEntry label="Tag code" submitLabel="Open" busy={opening !== null} onSubmit={(code) => open(code, 'typed')} />
      </section>
    </div>
  );
}

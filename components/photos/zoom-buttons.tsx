import { Maximize2, ZoomIn, ZoomOut } from 'lucide-react';
import { MAX_SCALE, type useZoomPan } from '@/components/photos/use-zoom-pan';

/** A button on the dark full-screen photo views. */
export const darkButton =
  'inline-flex min-h-11 min-w-11 items-center justify-center gap-2 rounded-md border border-slate-600 bg-slate-900 px-3 text-sm font-semibold text-white hover:bg-slate-800 disabled:opacity-50';

/** Zoom out, the scale, zoom in and fit, for one photo or for both sides of a comparison at once. */
export function ZoomButtons({ zoom, both = false }: { zoom: ReturnType<typeof useZoomPan>; both?: boolean }) {
  return (
    <>
      <button type="button" className={darkButton} onClick={zoom.zoomOut} disabled={zoom.view.scale <= 1} aria-label={both ? 'Zoom out both' : 'Zoom out'}>
        <ZoomOut aria-hidden className="size-5" />
      </button>
      <span className="w-14 text-center text-sm tabular-nums" aria-live="polite">
        {Math.round(zoom.view.scale * 100)}%
      </span>
      <button type="button" className={darkButton} onClick={zoom.zoomIn} disabled={zoom.view.scale >= MAX_SCALE} aria-label={both ? 'Zoom in both' : 'Zoom in'}>
        <ZoomIn aria-hidden className="size-5" />
      </button>
      <button type="button" className={darkButton} onClick={zoom.reset} disabled={zoom.view.scale === 1} aria-label={both ? 'Fit both' : 'Fit to screen'}>
        <Maximize2 aria-hidden className="size-5" />
      </button>
    </>
  );
}

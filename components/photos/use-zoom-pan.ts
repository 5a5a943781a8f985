'use client';

import { useCallback, useRef, useState, type KeyboardEvent, type PointerEvent, type WheelEvent } from 'react';

// Zoom and pan for reading a nameplate: wheel, pinch, drag, double-click, and the keyboard
// (+ and − zoom, arrows move, 0 fits). One state can drive several images (the comparison).

export interface View {
  scale: number;
  x: number;
  y: number;
}

export const MIN_SCALE = 1;
export const MAX_SCALE = 8;
const FIT: View = { scale: 1, x: 0, y: 0 };

function clamp(v: View, width: number, height: number): View {
  const scale = Math.min(MAX_SCALE, Math.max(MIN_SCALE, v.scale));
  const maxX = ((scale - 1) * width) / 2;
  const maxY = ((scale - 1) * height) / 2;
  return { scale, x: Math.min(maxX, Math.max(-maxX, v.x)), y: Math.min(maxY, Math.max(-maxY, v.y)) };
}

export function useZoomPan() {
  const [view, setView] = useState<View>(FIT);
  const size = useRef({ width: 1, height: 1 });
  const pointers = useRef(new Map<number, { x: number; y: number }>());
  const pinch = useRef<{ distance: number; scale: number } | null>(null);

  const update = useCallback((next: (v: View) => View) => setView((v) => clamp(next(v), size.current.width, size.current.height)), []);

  /** Zooms by `factor` keeping the point (px, py), relative to the centre, where it is. */
  const zoomAt = useCallback(
    (factor: number, px = 0, py = 0) =>
      update((v) => {
        const scale = Math.min(MAX_SCALE, Math.max(MIN_SCALE, v.scale * factor));
        const k = scale / v.scale;
        return { scale, x: px - (px - v.x) * k, y: py - (py - v.y) * k };
      }),
    [update],
  );

  const reset = useCallback(() => setView(FIT), []);

  function relative(el: HTMLElement, clientX: number, clientY: number) {
    const r = el.getBoundingClientRect();
    size.current = { width: r.width, height: r.height };
    return { px: clientX - r.left - r.width / 2, py: clientY - r.top - r.height / 2 };
  }

  const handlers = {
    onWheel(e: WheelEvent<HTMLElement>) {
      const { px, py } = relative(e.currentTarget, e.clientX, e.clientY);
      zoomAt(e.deltaY < 0 ? 1.2 : 1 / 1.2, px, py);
    },
    onDoubleClick(e: { currentTarget: HTMLElement; clientX: number; clientY: number }) {
      const { px, py } = relative(e.currentTarget, e.clientX, e.clientY);
      if (view.scale > 1) reset();
      else zoomAt(2.5, px, py);
    },
    onPointerDown(e: PointerEvent<HTMLElement>) {
      relative(e.currentTarget, e.clientX, e.clientY);
      e.currentTarget.setPointerCapture(e.pointerId);
      pointers.current.set(e.pointerId, { x: e.clientX, y: e.clientY });
      if (pointers.current.size === 2) {
        const [a, b] = [...pointers.current.values()];
        pinch.current = { distance: Math.hypot(a!.x - b!.x, a!.y - b!.y), scale: view.scale };
      }
    },
    onPointerMove(e: PointerEvent<HTMLElement>) {
      const last = pointers.current.get(e.pointerId);
      if (!last) return;
      pointers.current.set(e.pointerId, { x: e.clientX, y: e.clientY });
      if (pointers.current.size === 2 && pinch.current) {
        const [a, b] = [...pointers.current.values()];
        const distance = Math.hypot(a!.x - b!.x, a!.y - b!.y);
        const target = (pinch.current.scale * distance) / pinch.current.distance;
        const { px, py } = relative(e.currentTarget, (a!.x + b!.x) / 2, (a!.y + b!.y) / 2);
        update((v) => {
          const scale = Math.min(MAX_SCALE, Math.max(MIN_SCALE, target));
          const k = scale / v.scale;
          return { scale, x: px - (px - v.x) * k, y: py - (py - v.y) * k };
        });
      } else if (pointers.current.size === 1) {
        update((v) => ({ ...v, x: v.x + e.clientX - last.x, y: v.y + e.clientY - last.y }));
      }
    },
    onPointerUp(e: PointerEvent<HTMLElement>) {
      pointers.current.delete(e.pointerId);
      if (pointers.current.size < 2) pinch.current = null;
    },
    onPointerCancel(e: PointerEvent<HTMLElement>) {
      pointers.current.delete(e.pointerId);
      pinch.current = null;
    },
    /** Returns true when the key was used, so a caller can leave other keys (photo paging) alone. */
    onKeyDown(e: KeyboardEvent<HTMLElement>): boolean {
      const r = e.currentTarget.getBoundingClientRect();
      size.current = { width: r.width, height: r.height };
      const step = Math.max(40, r.width * 0.1);
      if (e.key === '+' || e.key === '=') zoomAt(1.25);
      else if (e.key === '-' || e.key === '_') zoomAt(1 / 1.25);
      else if (e.key === '0') reset();
      else if (view.scale > 1 && e.key === 'ArrowLeft') update((v) => ({ ...v, x: v.x + step }));
      else if (view.scale > 1 && e.key === 'ArrowRight') update((v) => ({ ...v, x: v.x - step }));
      else if (view.scale > 1 && e.key === 'ArrowUp') update((v) => ({ ...v, y: v.y + step }));
      else if (view.scale > 1 && e.key === 'ArrowDown') update((v) => ({ ...v, y: v.y - step }));
      else return false;
      e.preventDefault();
      return true;
    },
  };

  const measure = useCallback((el: HTMLElement | null) => {
    if (!el) return;
    const r = el.getBoundingClientRect();
    size.current = { width: r.width, height: r.height };
  }, []);

  return {
    view,
    zoomIn: () => zoomAt(1.5),
    zoomOut: () => zoomAt(1 / 1.5),
    reset,
    handlers,
    measure,
    transform: `translate(${view.x}px, ${view.y}px) scale(${view.scale})`,
  };
}

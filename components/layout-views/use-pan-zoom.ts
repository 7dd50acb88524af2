"use client";
/**
 * Pan and zoom of one SVG view: buttons, the mouse wheel, dragging and a two-finger pinch move its viewBox
 * (nothing in print). The wheel listener is registered as non-passive so a zoom does not also scroll the page.
 */
import { useCallback, useRef, useState } from "react";

const MIN = 0.5;
const MAX = 20;
const clamp = (z: number) => Math.min(Math.max(z, MIN), MAX);

export function usePanZoom(width: number, height: number, disabled = false) {
  const [zoom, setZoom] = useState(1);
  const [pan, setPan] = useState<[number, number]>([0, 0]);
  const pointers = useRef(new Map<number, [number, number]>());
  const pinch = useRef<number | null>(null);
  const frame = { x: (width / 2) * (1 - 1 / zoom) - pan[0], y: (height / 2) * (1 - 1 / zoom) - pan[1], w: width / zoom, h: height / zoom, zoom };
  const viewBox = `${frame.x} ${frame.y} ${frame.w} ${frame.h}`;

  // React registers wheel handlers as passive; a native non-passive one may cancel the page scroll
  const detach = useRef<(() => void) | null>(null);
  const svgRef = useCallback(
    (el: SVGSVGElement | null) => {
      detach.current?.();
      detach.current = null;
      if (!el || disabled) return;
      const onWheel = (e: WheelEvent) => {
        e.preventDefault();
        setZoom((z) => clamp(z * (e.deltaY < 0 ? 1.15 : 1 / 1.15)));
      };
      el.addEventListener("wheel", onWheel, { passive: false });
      detach.current = () => el.removeEventListener("wheel", onWheel);
    },
    [disabled],
  );

  const handlers = disabled
    ? {}
    : {
        onPointerDown: (e: React.PointerEvent<SVGSVGElement>) => {
          pointers.current.set(e.pointerId, [e.clientX, e.clientY]);
          pinch.current = null;
        },
        onPointerMove: (e: React.PointerEvent<SVGSVGElement>) => {
          const last = pointers.current.get(e.pointerId);
          if (!last) return;
          pointers.current.set(e.pointerId, [e.clientX, e.clientY]);
          if (pointers.current.size >= 2) {
            // two fingers: zoom by the change of their distance
            const [a, b] = [...pointers.current.values()];
            const d = Math.hypot(a[0] - b[0], a[1] - b[1]);
            if (pinch.current) setZoom((z) => clamp((z * d) / pinch.current!));
            pinch.current = d;
            return;
          }
          const k = width / ((e.currentTarget.clientWidth || width) * zoom);
          setPan(([x, y]) => [x + (e.clientX - last[0]) * k, y + (e.clientY - last[1]) * k]);
        },
        onPointerUp: (e: React.PointerEvent<SVGSVGElement>) => {
          pointers.current.delete(e.pointerId);
          pinch.current = null;
        },
        onPointerLeave: (e: React.PointerEvent<SVGSVGElement>) => {
          pointers.current.delete(e.pointerId);
          pinch.current = null;
        },
      };
  return {
    viewBox,
    frame,
    svgRef,
    handlers,
    zoomIn: () => setZoom((z) => clamp(z * 1.4)),
    zoomOut: () => setZoom((z) => clamp(z / 1.4)),
    reset: () => {
      setZoom(1);
      setPan([0, 0]);
    },
  };
}

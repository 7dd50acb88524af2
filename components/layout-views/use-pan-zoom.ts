"use client";
/** Pan and zoom of one SVG view: buttons, the mouse wheel and dragging move its viewBox (nothing in print). */
import { useRef, useState } from "react";

const MIN = 0.5;
const MAX = 20;

export function usePanZoom(width: number, height: number, disabled = false) {
  const [zoom, setZoom] = useState(1);
  const [pan, setPan] = useState<[number, number]>([0, 0]);
  const drag = useRef<[number, number] | null>(null);
  const clamp = (z: number) => Math.min(Math.max(z, MIN), MAX);
  const frame = { x: (width / 2) * (1 - 1 / zoom) - pan[0], y: (height / 2) * (1 - 1 / zoom) - pan[1], w: width / zoom, h: height / zoom, zoom };
  const viewBox = `${frame.x} ${frame.y} ${frame.w} ${frame.h}`;
  const handlers = disabled
    ? {}
    : {
        onWheel: (e: React.WheelEvent<SVGSVGElement>) => {
          e.preventDefault();
          setZoom((z) => clamp(z * (e.deltaY < 0 ? 1.15 : 1 / 1.15)));
        },
        onPointerDown: (e: React.PointerEvent<SVGSVGElement>) => {
          drag.current = [e.clientX, e.clientY];
        },
        onPointerMove: (e: React.PointerEvent<SVGSVGElement>) => {
          if (!drag.current) return;
          const [x0, y0] = drag.current;
          drag.current = [e.clientX, e.clientY];
          const k = width / ((e.currentTarget.clientWidth || width) * zoom);
          setPan(([a, b]) => [a + (e.clientX - x0) * k, b + (e.clientY - y0) * k]);
        },
        onPointerUp: () => {
          drag.current = null;
        },
        onPointerLeave: () => {
          drag.current = null;
        },
      };
  return {
    viewBox,
    frame,
    handlers,
    zoomIn: () => setZoom((z) => clamp(z * 1.4)),
    zoomOut: () => setZoom((z) => clamp(z / 1.4)),
    reset: () => {
      setZoom(1);
      setPan([0, 0]);
    },
  };
}

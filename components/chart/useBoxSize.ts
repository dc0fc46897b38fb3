"use client";
import { useEffect, useState } from "react";

/** Width of an element and the height left below it in the window, rounded so small jitters don't re-lay out. */
export function useBoxSize(el: HTMLElement | null, opts: { minHeight?: number; bottom?: number; full?: boolean } = {}) {
  const [size, setSize] = useState({ width: 0, height: 0 });
  const { minHeight = 420, bottom = 16, full = false } = opts;
  useEffect(() => {
    if (!el) return;
    let timer: ReturnType<typeof setTimeout> | undefined;
    const measure = () => {
      const r = el.getBoundingClientRect();
      const width = Math.floor(full ? window.innerWidth : r.width);
      const height = Math.floor(full ? window.innerHeight : Math.max(minHeight, window.innerHeight - Math.max(0, r.top) - bottom));
      setSize((s) => (Math.abs(s.width - width) < 2 && Math.abs(s.height - height) < 2 ? s : { width, height }));
    };
    measure();
    const later = () => {
      clearTimeout(timer);
      timer = setTimeout(measure, 150);
    };
    const ro = new ResizeObserver(later);
    ro.observe(el);
    window.addEventListener("resize", later);
    return () => {
      clearTimeout(timer);
      ro.disconnect();
      window.removeEventListener("resize", later);
    };
  }, [el, minHeight, bottom, full]);
  return size;
}

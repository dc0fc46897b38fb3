"use client";
// A PDF or image part, fitted to the stand: every page is drawn ahead into its own canvas and a turn
// only swaps which one is visible (no React render), the way the bandstand turns chart pages.
import { useEffect, useImperativeHandle, useRef, useState, type Ref } from "react";
import { drawPage, openPdf } from "./load-pdf";

export interface PartViewerControls {
  next(): boolean;
  back(): boolean;
  readonly page: number;
  readonly pages: number;
}

export interface PartViewerProps {
  file: Blob;
  /** MIME type of the part: application/pdf, image/png or image/jpeg. */
  type: string;
  label: string;
  width: number;
  height: number;
  controls?: Ref<PartViewerControls | null>;
  /** Told after each turn (and once when ready): page number, page count, at the first, at the last. */
  onView?: (page: number, pages: number, atStart: boolean, atEnd: boolean) => void;
}

const fileIds = new WeakMap<Blob, number>();
let nextFileId = 0;
function fileKey(b: Blob): number {
  let id = fileIds.get(b);
  if (id === undefined) fileIds.set(b, (id = ++nextFileId));
  return id;
}

export function PartViewer({ file, type, label, width, height, controls, onView }: PartViewerProps) {
  const host = useRef<HTMLDivElement>(null);
  const outer = useRef<HTMLDivElement>(null);
  const state = useRef({ page: 1, pages: 1 });
  const report = useRef(onView);
  const img = useRef<HTMLImageElement>(null);
  const isImage = type.startsWith("image/");
  // Set only from async work, so the effect never sets state as it starts; "drawing" is derived.
  const [drawn, setDrawn] = useState<{ key: string; status: "ready" | "failed" } | null>(null);
  const drawKey = `${fileKey(file)}:${width}x${height}:${label}`;
  const status = isImage ? "ready" : drawn?.key === drawKey ? drawn.status : "drawing";

  useEffect(() => {
    report.current = onView;
  });

  const show = (page: number) => {
    const sheets = host.current?.querySelectorAll<HTMLElement>("[data-part-page]") ?? [];
    sheets.forEach((el) => {
      const on = Number(el.dataset.partPage) === page;
      el.hidden = !on;
      el.setAttribute("aria-hidden", on ? "false" : "true");
    });
    state.current.page = page;
    if (outer.current) {
      outer.current.dataset.page = String(page);
      outer.current.dataset.pages = String(state.current.pages);
    }
    report.current?.(page, state.current.pages, page <= 1, page >= state.current.pages);
  };

  useImperativeHandle(controls, () => ({
    next: () => (state.current.page < state.current.pages ? (show(state.current.page + 1), true) : false),
    back: () => (state.current.page > 1 ? (show(state.current.page - 1), true) : false),
    get page() {
      return state.current.page;
    },
    get pages() {
      return state.current.pages;
    },
  }));

  useEffect(() => {
    if (isImage) {
      const url = URL.createObjectURL(file);
      if (img.current) img.current.src = url;
      state.current = { page: 1, pages: 1 };
      show(1);
      return () => URL.revokeObjectURL(url);
    }
    if (width <= 0 || height <= 0) return;
    let cancelled = false;
    (async () => {
      const doc = await openPdf(new Uint8Array(await file.arrayBuffer()));
      const root = host.current;
      if (cancelled || !root) return void doc.destroy();
      root.replaceChildren();
      const keep = state.current.page;
      state.current = { page: 1, pages: doc.numPages };
      for (let n = 1; n <= doc.numPages && !cancelled; n++) {
        const sheet = document.createElement("div");
        sheet.dataset.partPage = String(n);
        sheet.className = "pp-scan-sheet";
        sheet.hidden = n !== 1;
        const canvas = document.createElement("canvas");
        canvas.setAttribute("role", "img");
        canvas.setAttribute("aria-label", `${label}, page ${n} of ${doc.numPages}`);
        sheet.append(canvas);
        root.append(sheet);
        await drawPage(doc, n, canvas, width, height);
        if (n === 1 && !cancelled) setDrawn({ key: drawKey, status: "ready" });
      }
      if (!cancelled) show(Math.min(keep, doc.numPages));
      await doc.destroy();
    })().catch(() => !cancelled && setDrawn({ key: drawKey, status: "failed" }));
    return () => {
      cancelled = true;
    };
  }, [file, isImage, width, height, label, drawKey]);

  return (
    <div ref={outer} className="pp-scan" style={{ width, height }} data-testid="part-viewer" data-status={status}>
      {isImage ? (
        // eslint-disable-next-line @next/next/no-img-element -- a local blob, not an optimisable asset
        <img ref={img} alt={label} data-part-page="1" className="pp-scan-image" style={{ maxWidth: width, maxHeight: height }} />
      ) : (
        <div ref={host} className="pp-scan-pages" />
      )}
      {status === "drawing" ? <p className="pp-scan-note" role="status">Drawing the part…</p> : null}
      {status === "failed" ? <p className="pp-scan-note" role="alert">This part could not be opened. The file may be damaged.</p> : null}
    </div>
  );
}

"use client";
// pdf.js, loaded on first use. Its worker code is bundled with the app and run on the main thread
// (pdf.js's own fallback when `globalThis.pdfjsWorker` is set), so it is precached with the other
// chunks and works with no signal; nothing is fetched from elsewhere, fonts come from the PDF or
// the device. Pages are rendered ahead, so the main thread is free when a page is turned.
import type { PDFDocumentProxy } from "pdfjs-dist";

type PdfJs = typeof import("pdfjs-dist");
let loading: Promise<PdfJs> | null = null;

export function loadPdfJs(): Promise<PdfJs> {
  loading ??= (async () => {
    const worker = await import("pdfjs-dist/build/pdf.worker.min.mjs");
    (globalThis as { pdfjsWorker?: unknown }).pdfjsWorker ??= { WorkerMessageHandler: worker.WorkerMessageHandler };
    return import("pdfjs-dist");
  })();
  return loading;
}

export async function openPdf(data: Uint8Array): Promise<PDFDocumentProxy> {
  const pdfjs = await loadPdfJs();
  return pdfjs.getDocument({
    data,
    isEvalSupported: false,
    useSystemFonts: true,
    enableXfa: false,
    stopAtErrors: false,
  }).promise;
}

/** Draws one page into a canvas fitted inside width × height (CSS pixels), sharp on dense screens. */
export async function drawPage(doc: PDFDocumentProxy, pageNumber: number, canvas: HTMLCanvasElement, width: number, height: number): Promise<void> {
  const page = await doc.getPage(pageNumber);
  const base = page.getViewport({ scale: 1 });
  const scale = Math.max(0.1, Math.min(width / base.width, height / base.height));
  const ratio = Math.min(3, window.devicePixelRatio || 1);
  const viewport = page.getViewport({ scale: scale * ratio });
  canvas.width = Math.floor(viewport.width);
  canvas.height = Math.floor(viewport.height);
  canvas.style.width = `${Math.floor(viewport.width / ratio)}px`;
  canvas.style.height = `${Math.floor(viewport.height / ratio)}px`;
  const ctx = canvas.getContext("2d");
  if (!ctx) throw new Error("This browser cannot draw the part.");
  ctx.fillStyle = "#ffffff";
  ctx.fillRect(0, 0, canvas.width, canvas.height);
  await page.render({ canvas, canvasContext: ctx, viewport }).promise;
}

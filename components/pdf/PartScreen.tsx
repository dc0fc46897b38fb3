"use client";
// A part read full screen on the stand: the bandstand's themes, tap zones and pedal keys (the same
// device settings), a page counter, and a way back.
import Link from "next/link";
import { useCallback, useEffect, useRef, useState } from "react";
import "@/components/bandstand/bandstand.css";
import { saveReadingSettings, useReadingSettings } from "@/components/bandstand/settings";
import { usePedalKeys } from "@/components/bandstand/usePedalKeys";
import { useWakeLock } from "@/components/bandstand/useWakeLock";
import { PartViewer, type PartViewerControls } from "./PartViewer";
import "./part.css";

const BAR_HEIGHT = 44;

export interface PartScreenProps {
  file: Blob;
  type: string;
  label: string;
  exitHref: string;
  /** Shown when the device has no signal: the part is read from the device. */
  offline?: boolean;
}

export function PartScreen({ file, type, label, exitHref, offline }: PartScreenProps) {
  const settings = useReadingSettings();
  const controls = useRef<PartViewerControls>(null);
  const counter = useRef<HTMLSpanElement>(null);
  const [size, setSize] = useState({ width: 0, height: 0 });
  useWakeLock();

  useEffect(() => {
    const measure = () => setSize({ width: window.innerWidth, height: window.innerHeight - BAR_HEIGHT });
    measure();
    window.addEventListener("resize", measure);
    return () => window.removeEventListener("resize", measure);
  }, []);

  const turn = useCallback((delta: 1 | -1) => (delta > 0 ? controls.current?.next() : controls.current?.back()), []);
  usePedalKeys(settings.nextKeys, settings.backKeys, turn);

  return (
    <div className={`pp-bandstand ${settings.theme === "ember" ? "pp-theme-ember" : "pp-theme-stage"}`} data-testid="part-screen" data-theme={settings.theme}>
      <div className="pp-bandstand-stage" style={{ height: size.height }}>
        {size.width > 0 ? (
          <PartViewer
            file={file}
            type={type}
            label={label}
            width={size.width}
            height={size.height}
            controls={controls}
            onView={(page, pages) => {
              if (counter.current) counter.current.textContent = `${page} / ${pages}`;
            }}
          />
        ) : null}
        <button type="button" className="pp-tap pp-tap-back" aria-label="Previous page" data-testid="tap-back" onClick={() => turn(-1)} tabIndex={-1} />
        <button type="button" className="pp-tap pp-tap-next" aria-label="Next page" data-testid="tap-next" onClick={() => turn(1)} tabIndex={-1} />
      </div>
      <nav className="pp-bandstand-bar" aria-label="Part controls" style={{ height: BAR_HEIGHT }}>
        <Link href={exitHref} className="pp-bar-button" data-testid="part-exit">
          Close
        </Link>
        <span className="pp-bar-title">{label}</span>
        {offline ? <span data-testid="offline-badge">No signal: reading from this device</span> : null}
        <span ref={counter} className="pp-bar-counter" data-testid="page-counter" aria-live="polite">
          1 / 1
        </span>
        <button
          type="button"
          className="pp-bar-button"
          onClick={() => saveReadingSettings({ ...settings, theme: settings.theme === "stage" ? "ember" : "stage" })}
          aria-label={settings.theme === "stage" ? "Switch to the red night theme" : "Switch to the dark theme"}
        >
          Light
        </button>
      </nav>
    </div>
  );
}

"use client";
// Reading settings for this device: which keys a page-turn pedal sends, the bandstand light, the early turn.
import Link from "next/link";
import { useEffect, useState } from "react";
import { Button } from "@/components/ui/Button";
import { PageColumn, PageTitle } from "@/components/ui/Page";
import { DEFAULT_SETTINGS, keyName, saveReadingSettings, useReadingSettings, type ReadingSettings, type Theme } from "./settings";

type Which = "nextKeys" | "backKeys";

function KeyList({ which, title, settings }: { which: Which; title: string; settings: ReadingSettings }) {
  const [listening, setListening] = useState(false);
  // The key a message speaks of: once that key leaves this list, the message no longer holds.
  const [said, setMessage] = useState<{ text: string; key?: string }>({ text: "" });
  const message = said.key === undefined || settings[which].includes(said.key) ? said.text : "";
  useEffect(() => {
    if (!listening) return;
    const onKey = (e: KeyboardEvent) => {
      e.preventDefault();
      e.stopPropagation();
      setListening(false);
      if (e.key === "Escape") return setMessage({ text: "Nothing added." });
      const other: Which = which === "nextKeys" ? "backKeys" : "nextKeys";
      const next = {
        ...settings,
        [which]: settings[which].includes(e.key) ? settings[which] : [...settings[which], e.key].slice(-8),
        [other]: settings[other].filter((k) => k !== e.key),
      };
      saveReadingSettings(next);
      setMessage({ text: `${keyName(e.key)} now turns ${which === "nextKeys" ? "forward" : "back"}.`, key: e.key });
    };
    window.addEventListener("keydown", onKey, { capture: true });
    return () => window.removeEventListener("keydown", onKey, { capture: true });
  }, [listening, settings, which]);

  return (
    <section aria-labelledby={`${which}-title`} className="rounded-lg border border-paper-dim bg-white p-4">
      <h2 id={`${which}-title`} className="text-lg font-semibold">
        {title}
      </h2>
      <ul className="my-3 flex flex-wrap gap-2" data-testid={`${which}-list`}>
        {settings[which].map((k) => (
          <li key={k} className="flex items-center gap-1 rounded-md border border-ink-muted px-2 py-1">
            <kbd className="font-mono">{keyName(k)}</kbd>
            <button
              type="button"
              className="min-h-8 px-2 text-red-800 underline-offset-2 hover:underline"
              aria-label={`Remove ${keyName(k)}`}
              onClick={() => saveReadingSettings({ ...settings, [which]: settings[which].filter((x) => x !== k) })}
            >
              Remove
            </button>
          </li>
        ))}
      </ul>
      <Button tone="secondary" onClick={() => setListening(true)} data-testid={`${which}-add`} aria-describedby={`${which}-msg`}>
        {listening ? "Press the pedal or key now… (Esc to cancel)" : "Add a key"}
      </Button>
      <p id={`${which}-msg`} aria-live="polite" className="mt-2 text-sm text-ink-muted">
        {message}
      </p>
    </section>
  );
}

export function SettingsScreen() {
  const settings = useReadingSettings();
  const setTheme = (theme: Theme) => saveReadingSettings({ ...settings, theme });
  // A reset remounts the key lists, so no "… now turns forward" is left describing a key it removed.
  const [resets, setResets] = useState(0);
  const [resetMessage, setResetMessage] = useState("");
  const reset = () => {
    saveReadingSettings(DEFAULT_SETTINGS);
    setResets((n) => n + 1);
    setResetMessage(
      `Back to the usual settings: ${DEFAULT_SETTINGS.nextKeys.map(keyName).join(", ")} turn forward; ${DEFAULT_SETTINGS.backKeys.map(keyName).join(", ")} turn back.`,
    );
  };
  return (
    <PageColumn>
      <Link href="/bands" className="mb-2 inline-block text-sm text-ink-muted underline-offset-4 hover:underline">
        ← Your bands
      </Link>
      <PageTitle lead="Kept on this device only: each stand has its own pedal and its own light.">Reading settings</PageTitle>
      <div className="flex flex-col gap-5">
        <KeyList key={`next-${resets}`} which="nextKeys" title="Keys that turn forward" settings={settings} />
        <KeyList key={`back-${resets}`} which="backKeys" title="Keys that turn back" settings={settings} />
        <fieldset className="rounded-lg border border-paper-dim bg-white p-4">
          <legend className="px-1 text-lg font-semibold">Bandstand light</legend>
          {(
            [
              ["stage", "Stage: light text on near-black"],
              ["ember", "Ember: dim red on black, kindest to dark-adapted eyes"],
            ] as const
          ).map(([value, label]) => (
            <label key={value} className="mt-2 flex items-center gap-3">
              <input type="radio" name="theme" value={value} checked={settings.theme === value} onChange={() => setTheme(value)} className="size-5" />
              {label}
            </label>
          ))}
        </fieldset>
        <label className="flex items-center gap-3 rounded-lg border border-paper-dim bg-white p-4">
          <input
            type="checkbox"
            className="size-5"
            checked={settings.earlyTurn}
            onChange={(e) => saveReadingSettings({ ...settings, earlyTurn: e.target.checked })}
            data-testid="early-turn-setting"
          />
          <span>
            <span className="font-semibold">Early turn</span>
            <span className="block text-sm text-ink-muted">
              One press before each page ends, the next page&apos;s first lines rise into place under a thin brass rule marked &ldquo;next&rdquo;, so you read on while the rest of the page turns.
            </span>
          </span>
        </label>
        <div>
          <Button tone="quiet" onClick={reset} data-testid="settings-reset">
            Back to the usual settings
          </Button>
          <p aria-live="polite" className="mt-2 text-sm text-ink-muted" data-testid="settings-reset-msg">
            {resetMessage}
          </p>
        </div>
      </div>
    </PageColumn>
  );
}

"use client";
import { useEffect, useRef } from "react";

/** Calls `onTurn(+1 | −1)` for the mapped keys; ignores keys typed into form fields. */
export function usePedalKeys(nextKeys: string[], backKeys: string[], onTurn: (delta: 1 | -1) => void) {
  const turn = useRef(onTurn);
  useEffect(() => {
    turn.current = onTurn;
  });
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (e.altKey || e.ctrlKey || e.metaKey) return;
      const t = e.target as HTMLElement | null;
      if (t && (t.tagName === "INPUT" || t.tagName === "SELECT" || t.tagName === "TEXTAREA" || t.isContentEditable)) return;
      const delta = nextKeys.includes(e.key) ? 1 : backKeys.includes(e.key) ? -1 : 0;
      if (!delta) return;
      e.preventDefault();
      turn.current(delta);
    };
    // A mapped Space on a focused button would also press it on key-up; the page turn wins.
    const onKeyUp = (e: KeyboardEvent) => {
      if ((e.target as HTMLElement | null)?.tagName === "BUTTON" && nextKeys.concat(backKeys).includes(e.key)) e.preventDefault();
    };
    window.addEventListener("keydown", onKey);
    window.addEventListener("keyup", onKeyUp);
    return () => {
      window.removeEventListener("keydown", onKey);
      window.removeEventListener("keyup", onKeyUp);
    };
  }, [nextKeys, backKeys]);
}

// What a revision changed compared with the one before it, in words for the history list.
import { keyInWords } from "@/lib/music/part-key";

export interface RevisionLike {
  revision: number;
  title: string;
  sourceText: string;
  meta: Record<string, unknown>;
}

const FIELDS: Array<[string, string]> = [
  ["key", "key"],
  ["meter", "time"],
  ["tempo", "tempo"],
  ["feel", "feel"],
  ["composer", "composer"],
];

function show(field: string, value: unknown): string {
  if (value === null || value === undefined || value === "") return "none";
  const text = String(value);
  return field === "key" ? keyInWords(text) : text;
}

export function describeChange(rev: RevisionLike, previous: RevisionLike | undefined): string[] {
  if (!previous) return ["first version"];
  const out: string[] = [];
  if (rev.title !== previous.title) out.push(`title “${previous.title}” → “${rev.title}”`);
  for (const [field, word] of FIELDS) {
    const a = previous.meta[field];
    const b = rev.meta[field];
    if ((a ?? "") !== (b ?? "")) out.push(`${word} ${show(field, a)} → ${show(field, b)}`);
  }
  if (rev.sourceText !== previous.sourceText) out.push("chart text");
  return out.length ? out : ["no visible change"];
}

import "server-only";

// Refuses passwords that are among the most guessed ones, or made of the person's own name or
// address, with the zxcvbn estimator and its common and English word lists.
import { ZxcvbnFactory } from "@zxcvbn-ts/core";
import * as common from "@zxcvbn-ts/language-common";
import * as en from "@zxcvbn-ts/language-en";

let checker: ZxcvbnFactory | null = null;

function zxcvbn(): ZxcvbnFactory {
  checker ??= new ZxcvbnFactory({
    dictionary: { ...common.dictionary, ...en.dictionary },
    graphs: common.adjacencyGraphs,
    translations: en.translations,
  });
  return checker;
}

/** Score 0–4; below 2 is guessed within minutes to hours by an offline attack. */
export const MIN_PASSWORD_SCORE = 2;

/** A sentence saying why the password is refused, or null when it is strong enough. */
export function weakPasswordReason(password: string, personal: string[]): string | null {
  const inputs = personal.flatMap((p) => [p, ...p.toLowerCase().split(/[@.\s_-]+/)]).filter((p) => p.length >= 3);
  const lower = password.toLowerCase();
  if (inputs.some((p) => lower === p.toLowerCase())) return "Choose a password that is not your name or e-mail address";
  const result = zxcvbn().check(password.slice(0, 100), inputs);
  if (result.score >= MIN_PASSWORD_SCORE) return null;
  return "That password is too easy to guess: use a few unrelated words or a longer phrase";
}

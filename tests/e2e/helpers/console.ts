// Zero console errors on every page (issue 16 item 11). Any spec can watch a page with `watchConsole`,
// or import `test` from here to have every test fail on a console error or an uncaught exception.
// Expected noise (a test that cuts the network on purpose) is let through by pattern, never by default.
import { test as base, expect, type Page } from "@playwright/test";

export interface ConsoleWatch {
  errors: string[];
  /** Fails with every error seen, each with the page it happened on. */
  expectClean(): void;
}

export function watchConsole(page: Page, allow: readonly RegExp[] = []): ConsoleWatch {
  const errors: string[] = [];
  const keep = (text: string) => {
    if (!allow.some((re) => re.test(text))) errors.push(`${text} (on ${page.url()})`);
  };
  page.on("console", (msg) => {
    if (msg.type() !== "error") return;
    const where = msg.location().url;
    keep(where ? `${msg.text()} [${where}]` : msg.text());
  });
  page.on("pageerror", (err) => keep(`uncaught: ${err.message}`));
  return {
    errors,
    expectClean: () => expect(errors, "console errors").toEqual([]),
  };
}

/** `test` with a console watch on `page` that every test must leave clean. */
export const test = base.extend<{ consoleWatch: ConsoleWatch }>({
  consoleWatch: [
    async ({ page }, use) => {
      const watch = watchConsole(page);
      await use(watch);
      watch.expectClean();
    },
    { auto: true },
  ],
});

export { expect };

import { expect, type Locator, type Page } from "@playwright/test";

/** The band's library table, through its data-testid hooks. */
export class LibraryPage {
  readonly table: Locator;
  readonly rows: Locator;
  readonly search: Locator;
  readonly keyFilter: Locator;
  readonly feelFilter: Locator;
  readonly sort: Locator;
  readonly newChart: Locator;
  readonly editLinks: Locator;

  constructor(readonly page: Page) {
    this.table = page.getByTestId("library-table");
    this.rows = page.getByTestId("library-row");
    this.search = page.getByTestId("library-search");
    this.keyFilter = page.getByTestId("library-filter-key");
    this.feelFilter = page.getByTestId("library-filter-feel");
    this.sort = page.getByTestId("library-sort");
    this.newChart = page.getByTestId("new-chart");
    this.editLinks = page.getByTestId("edit-chart");
  }

  async goto(bandId: string, query = ""): Promise<void> {
    await this.page.goto(`/bands/${bandId}${query}`);
    await this.waitForBook();
  }

  /** The table fills from the local book once the first sync has landed. */
  async waitForBook(minRows = 1): Promise<void> {
    await expect(this.rows.nth(minRows - 1)).toBeVisible({ timeout: 30_000 });
  }

  row(title: string): Locator {
    return this.rows.filter({ has: this.page.getByTestId("chart-link").getByText(title, { exact: true }) });
  }

  async titles(): Promise<string[]> {
    return this.page.getByTestId("chart-link").allInnerTexts();
  }

  async column(testId: "cell-key" | "cell-feel" | "cell-tempo"): Promise<string[]> {
    return (await this.page.getByTestId(testId).allInnerTexts()).map((t) => t.trim());
  }
}

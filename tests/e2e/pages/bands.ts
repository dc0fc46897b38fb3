import type { Locator, Page } from "@playwright/test";

export class BandsPage {
  readonly bandLinks: Locator;
  readonly name: Locator;
  readonly city: Locator;
  readonly create: Locator;

  constructor(readonly page: Page) {
    this.bandLinks = page.getByTestId("band-link");
    this.name = page.getByTestId("band-name");
    this.city = page.getByTestId("band-city");
    this.create = page.getByTestId("create-band");
  }

  async goto(): Promise<void> {
    await this.page.goto("/bands");
    await this.name.waitFor({ timeout: 30_000 });
  }

  /** Starts a band and returns its id, read from the library's address. */
  async createBand(name: string, city = ""): Promise<string> {
    await this.name.fill(name);
    if (city) await this.city.fill(city);
    await this.create.click();
    await this.page.waitForURL(/\/bands\/[^/?#]+$/, { timeout: 30_000 });
    const id = new URL(this.page.url()).pathname.split("/")[2];
    if (!id) throw new Error(`no band id in ${this.page.url()}`);
    return decodeURIComponent(id);
  }
}

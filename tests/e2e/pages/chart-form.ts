import type { Locator, Page } from "@playwright/test";

export class ChartFormPage {
  readonly title: Locator;
  readonly composer: Locator;
  readonly key: Locator;
  readonly meter: Locator;
  readonly tempo: Locator;
  readonly feel: Locator;
  readonly text: Locator;
  readonly message: Locator;
  readonly save: Locator;
  readonly textError: Locator;
  readonly problemLine: Locator;

  constructor(readonly page: Page) {
    this.title = page.getByTestId("chart-title");
    this.composer = page.getByTestId("chart-composer");
    this.key = page.getByTestId("chart-key");
    this.meter = page.getByTestId("chart-meter");
    this.tempo = page.getByTestId("chart-tempo");
    this.feel = page.getByTestId("chart-feel");
    this.text = page.getByTestId("chart-text");
    this.message = page.getByTestId("chart-message");
    this.save = page.getByTestId("chart-save");
    this.textError = page.getByTestId("chart-text-error");
    this.problemLine = page.getByTestId("chart-text-problem-line");
  }

  async gotoNew(bandId: string): Promise<void> {
    await this.page.goto(`/bands/${bandId}/charts/new`);
    await this.title.waitFor({ timeout: 30_000 });
  }

  async fill(chart: { title: string; composer?: string; key?: string; meter?: string; tempo?: string; feel?: string; text: string; message?: string }) {
    await this.title.fill(chart.title);
    if (chart.composer) await this.composer.fill(chart.composer);
    if (chart.key) await this.key.selectOption(chart.key);
    if (chart.meter) await this.meter.selectOption(chart.meter);
    if (chart.tempo) await this.tempo.fill(chart.tempo);
    if (chart.feel) await this.feel.fill(chart.feel);
    await this.text.fill(chart.text);
    if (chart.message) await this.message.fill(chart.message);
  }
}

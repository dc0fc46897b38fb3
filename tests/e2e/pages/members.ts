import type { Locator, Page } from "@playwright/test";

export class MembersPage {
  readonly inviteEmail: Locator;
  readonly inviteRole: Locator;
  readonly inviteInstrument: Locator;
  readonly inviteSend: Locator;
  readonly inviteResult: Locator;
  readonly roster: Locator;

  constructor(readonly page: Page) {
    this.inviteEmail = page.getByTestId("invite-email");
    this.inviteRole = page.getByTestId("invite-role");
    this.inviteInstrument = page.getByTestId("invite-instrument");
    this.inviteSend = page.getByTestId("invite-send");
    this.inviteResult = page.getByTestId("invite-result");
    this.roster = page.getByTestId("member-row");
  }

  rowFor(email: string): Locator {
    return this.page.locator(`[data-testid="member-row"][data-email="${email}"]`);
  }

  async goto(bandId: string): Promise<void> {
    await this.page.goto(`/bands/${bandId}/members`);
    await this.inviteEmail.waitFor();
  }

  async invite(email: string, role: "leader" | "arranger" | "player" | "sub", instrument = "concert"): Promise<void> {
    await this.inviteEmail.fill(email);
    await this.inviteRole.selectOption(role);
    await this.inviteInstrument.selectOption(instrument);
    await this.inviteSend.click();
  }
}

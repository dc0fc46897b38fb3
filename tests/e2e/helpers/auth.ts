// Signing up and in through the real pages, as a musician would.
import { expect, type Page } from "@playwright/test";

export interface Person {
  name: string;
  email: string;
  password: string;
}

let counter = 0;
/** A fresh person for this run: unique e-mail, so reruns against one database do not collide. */
export function newPerson(label: string): Person {
  counter += 1;
  const stamp = `${Date.now().toString(36)}${counter}`;
  return { name: `${label} ${stamp}`, email: `${label.toLowerCase().replace(/\W+/g, "")}.${stamp}@example.test`, password: `pp-${stamp}-secret` };
}

export async function fillSignIn(page: Page, email: string, password: string): Promise<void> {
  await page.getByLabel("Email", { exact: true }).fill(email);
  await page.getByLabel("Password", { exact: true }).fill(password);
  await page.getByRole("button", { name: /^sign in/i }).click();
}

export async function signIn(page: Page, email: string, password: string, callbackUrl = "/bands"): Promise<void> {
  await page.goto(`/signin?callbackUrl=${encodeURIComponent(callbackUrl)}`);
  await fillSignIn(page, email, password);
  await expect(page).not.toHaveURL(/\/signin/, { timeout: 30_000 });
}

export async function fillSignUp(page: Page, person: Person): Promise<void> {
  await page.getByLabel(/^(your )?name$/i).fill(person.name);
  // On an invite the address is already filled in from the invite.
  const email = page.getByLabel("Email", { exact: true });
  if (await email.isEditable()) await email.fill(person.email);
  await page.getByLabel("Password", { exact: true }).fill(person.password);
  await page.getByRole("button", { name: /sign up|create|join/i }).click();
}

export async function signUp(page: Page, person: Person, callbackUrl = "/bands"): Promise<void> {
  await page.goto(`/signup?callbackUrl=${encodeURIComponent(callbackUrl)}`);
  await fillSignUp(page, person);
  await expect(page).not.toHaveURL(/\/signup/, { timeout: 30_000 });
}

import { expect, type Page } from '@playwright/test';

/** Page object for the sign-up, sign-in and sign-out screens. */
export class AuthPages {
  constructor(private readonly page: Page) {}

  async signUp(values: { name: string; organization: string; email: string; password: string }) {
    await this.page.goto('/sign-up');
    await this.page.getByLabel('Your name').fill(values.name);
    await this.page.getByLabel('Organisation').fill(values.organization);
    await this.page.getByLabel('Work e-mail').fill(values.email);
    await this.page.getByLabel('Password').fill(values.password);
    await this.page.getByRole('button', { name: 'Create organisation' }).click();
  }

  async signIn(email: string, password: string) {
    await this.page.goto('/sign-in');
    await this.page.getByLabel('E-mail').fill(email);
    await this.page.getByLabel('Password').fill(password);
    await this.page.getByRole('button', { name: 'Sign in' }).click();
  }

  async signOut() {
    await this.page.getByRole('button', { name: 'Sign out' }).click();
    await expect(this.page).toHaveURL(/\/sign-in/);
  }

  signedInAs() {
    return this.page.getByTestId('signed-in-as');
  }
}

export const DEMO_PASSWORD = 'demo-outturn-2026';
export const demoEmail = (role: string) => `${role}@kestrelvale.example`;

/**
 * The end-to-end suite's `test`: Playwright's own, with a guard that fails a test when any page
 * it opened wrote an error to the browser console, threw an uncaught error, or warned of a React
 * hydration mismatch. Every spec imports `test` and `expect` from here.
 *
 * A test that provokes an error on purpose (a refused save answered 409 makes the browser log
 * "Failed to load resource") says which messages it expects, and only those:
 *
 *   test.use({ allowedConsoleErrors: [/status of 409/] });
 *
 * or, to let a message through on one page only, `{ page: /\/brief$/, text: /#418/ }`.
 */
import { test as base, expect, type ConsoleMessage, type Page } from '@playwright/test';

/** React's hydration warnings, in development wording and as the minified production errors. */
const HYDRATION =
  /hydrat|did not match|Minified React error #(418|419|421|422|423|425)\b|react\.dev\/errors\/(418|419|421|422|423|425)/i;

export type ConsoleProblem = { page: string; kind: 'console' | 'pageerror' | 'hydration'; text: string };

/** Starts collecting the problems of one page; returns the list it fills. */
export function watchConsole(page: Page, into: ConsoleProblem[] = []): ConsoleProblem[] {
  page.on('console', (message: ConsoleMessage) => {
    const text = message.text();
    if (message.type() === 'error') {
      const where = message.location()?.url;
      into.push({
        page: page.url(),
        kind: HYDRATION.test(text) ? 'hydration' : 'console',
        text: where && !text.includes(where) ? `${text} (${where})` : text,
      });
    } else if (message.type() === 'warning' && HYDRATION.test(text)) {
      into.push({ page: page.url(), kind: 'hydration', text });
    }
  });
  page.on('pageerror', (error) => {
    into.push({
      page: page.url(),
      kind: HYDRATION.test(error.message) ? 'hydration' : 'pageerror',
      text: error.message,
    });
  });
  return into;
}

/** A message a test expects: any page's, or one page's only. */
export type AllowedConsoleError = RegExp | { page: RegExp; text: RegExp };

/** The problems that none of the allowed patterns explains. */
export function unexpectedProblems(
  problems: ConsoleProblem[],
  allowed: AllowedConsoleError[],
): ConsoleProblem[] {
  const explains = (a: AllowedConsoleError, p: ConsoleProblem) =>
    a instanceof RegExp ? a.test(p.text) : a.page.test(p.page) && a.text.test(p.text);
  return problems.filter((p) => !allowed.some((a) => explains(a, p)));
}

export const test = base.extend<{
  allowedConsoleErrors: AllowedConsoleError[];
  consoleGuard: void;
}>({
  allowedConsoleErrors: [[], { option: true }],
  consoleGuard: [
    async ({ context, allowedConsoleErrors }, use, testInfo) => {
      const problems: ConsoleProblem[] = [];
      for (const page of context.pages()) watchConsole(page, problems);
      context.on('page', (page) => watchConsole(page, problems));
      await use();
      const unexpected = unexpectedProblems(problems, allowedConsoleErrors);
      // A test that failed already says why; one that passed fails here.
      if (unexpected.length && testInfo.status === 'passed') {
        throw new Error(
          `The browser console reported ${unexpected.length} problem(s):\n` +
            unexpected.map((p) => `  [${p.kind}] ${p.page}: ${p.text}`).join('\n'),
        );
      }
    },
    { auto: true },
  ],
});

export { expect };

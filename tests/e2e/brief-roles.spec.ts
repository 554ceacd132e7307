import type { Page } from '@playwright/test';
import { expect, test } from './fixtures';
import { AuthPages } from './pages/auth';
import { BriefPages } from './pages/brief';
import { closeFixtureDb, projectWithRegisters, succeededRun } from './pages/brief-fixture';
import { addMember, newOrganisation } from '../integration/helpers/http';

const MEMBER_PASSWORD = 'another long password';

test.afterAll(closeFixtureDb);

/** Every console error and uncaught page error (a hydration mismatch is both), for a final check. */
function watchErrors(page: Page) {
  const errors: string[] = [];
  page.on('console', (m) => {
    if (m.type() === 'error') errors.push(m.text());
  });
  page.on('pageerror', (e) => errors.push(e.message));
  return errors;
}

test('a sponsor lands on the briefs waiting for a decision; the brief names the scenario and speaks of both targets', async ({
  page,
}) => {
  const org = await newOrganisation('e2e-sponsor');
  const estimator = await addMember(org.client, 'estimator');
  const sponsor = await addMember(org.client, 'sponsor');
  const { projectId, code } = await projectWithRegisters(org.client, 'Harbour wall', { schedule: true });
  // Base date Monday 5 Jan 2026; 31 Jul 2026 is 150 working days on, short of the simulated P80.
  const runId = await succeededRun(estimator.client, projectId, { finishTarget: '2026-07-31' });
  const sent = await estimator.client.post(`/api/projects/${projectId}/brief/${runId}/send`, {});
  expect(sent.status).toBe(200);

  const errors = watchErrors(page);
  await new AuthPages(page).signIn(sponsor.email, MEMBER_PASSWORD);
  await expect(page).toHaveURL(/\/projects$/);
  const waiting = page.getByTestId('awaiting-decision');
  await expect(waiting).toContainText(`${code} · brief of run ${runId}`);
  await expect(waiting).toContainText('sent by estimator person');
  // The list comes before the projects.
  const listTop = (await waiting.boundingBox())!.y;
  const projectsTop = (await page.getByRole('heading', { name: 'Projects' }).boundingBox())!.y;
  expect(listTop).toBeLessThan(projectsTop);

  await page.screenshot({ path: '/tmp/sponsor-landing.png' });
  await waiting.getByRole('link', { name: `${code} · brief of run ${runId}` }).click();
  await expect(page).toHaveURL(new RegExp(`/projects/${projectId}/runs/${runId}/brief$`));
  await expect(page.getByTestId('scenario')).toContainText(
    'Figures before any risk response (pre-mitigation)',
  );
  const headline = page.getByTestId('headline');
  await expect(headline).toContainText('Funding at P80 (before any risk response)');
  await expect(headline).toContainText('The finish target of 31 Jul 2026 is missed');
  await expect(headline).toContainText('the cost target of €7,500,000');
  await expect(headline).toContainText('both targets together');
  await expect(page.getByTestId('finish-P80')).toContainText('2026');
  await expect(page.getByTestId('finish-s-curve')).toBeVisible();
  await expect(page.getByTestId('cost-drivers')).toContainText('Risk event');
  await expect(page.getByTestId('finish-drivers')).toContainText('A1 Cofferdam and piling');
  await expect(page.getByTestId('class-verdict')).toBeVisible();
  await page.setViewportSize({ width: 1440, height: 900 });
  await page.screenshot({ path: '/tmp/brief-sponsor-1440.png', fullPage: true });
  await page.setViewportSize({ width: 1280, height: 860 });
  await page.screenshot({ path: '/tmp/brief-sponsor-1280.png', fullPage: true });
  await page.emulateMedia({ media: 'print' });
  await page.screenshot({ path: '/tmp/brief-sponsor-print.png', fullPage: true });
  await page.emulateMedia({ media: 'screen' });
  await page.reload();
  await expect(headline).toBeVisible();
  expect(errors).toEqual([]);
});

test('a billing member lands on billing, and the forbidden page leads back there', async ({ page }) => {
  const org = await newOrganisation('e2e-billing');
  const billing = await addMember(org.client, 'billing');
  const errors = watchErrors(page);
  await new AuthPages(page).signIn(billing.email, MEMBER_PASSWORD);
  await expect(page).toHaveURL(/\/settings\/billing$/);
  await page.goto('/projects');
  await expect(page).toHaveURL(/\/settings\/billing$/);
  await page.goto('/settings/members');
  await expect(page).toHaveURL(/\/forbidden$/);
  await page.getByTestId('forbidden-back').click();
  await expect(page).toHaveURL(/\/settings\/billing$/);
  expect(errors).toEqual([]);
});

test('an owner cannot approve a run they started until self-approval is allowed; then the decision is marked', async ({
  page,
}) => {
  const org = await newOrganisation('e2e-duties');
  const { projectId } = await projectWithRegisters(org.client);
  const runId = await succeededRun(org.client, projectId);

  const errors = watchErrors(page);
  await new AuthPages(page).signIn(org.email, org.password);
  await expect(page).toHaveURL(/\/projects$/);
  const brief = new BriefPages(page);
  await brief.open(projectId, runId);
  await expect(page.getByTestId('self-approval-refused')).toContainText(
    // The new project's first run is run 1: runs are named by their number in the project.
    'You started run 1, so someone else must approve it as the baseline',
  );
  await expect(page.getByLabel('Approve as the baseline')).toBeDisabled();
  await page.screenshot({ path: '/tmp/brief-owner-refused.png' });

  await page.goto('/settings/organization');
  await page.getByLabel('Allow self-approval').check();
  await expect(page.getByText('Saved: the person who started a run may now approve it')).toBeVisible();

  await brief.open(projectId, runId);
  await expect(page.getByTestId('self-approval-note')).toBeVisible();
  await brief.approve('Small team: the owner approves.');
  await expect(brief.decisionRecord()).toContainText('Approved as the baseline');
  await expect(page.getByTestId('self-approved')).toHaveText('Self-approved');

  // A post-mitigation baseline joins the trend: it is its own line, and its change is not
  // measured from the pre-mitigation one.
  const postRun = await succeededRun(org.client, projectId, { riskValues: 'post' });
  const decided = await org.client.post(`/api/projects/${projectId}/decisions`, {
    runId: postRun,
    decision: 'approved',
  });
  expect(decided.status).toBe(201);

  await brief.openTrend(projectId);
  await expect(page.getByTestId(`trend-row-${runId}`)).toContainText('self-approved');
  await expect(page.getByTestId(`trend-row-${runId}`)).toContainText('pre-mitigation');
  await expect(page.getByTestId(`trend-row-${postRun}`)).toContainText('post-mitigation');
  await expect(page.getByTestId(`trend-row-${postRun}`).locator('td').nth(6)).toHaveText('—');
  await expect(page.getByTestId('current-baseline')).toContainText('(self-approved)');
  await expect(page.getByTestId('trend-contingency')).toBeVisible();
  await page.screenshot({ path: '/tmp/trend-self-approved.png', fullPage: true });
  expect(errors).toEqual([]);
});

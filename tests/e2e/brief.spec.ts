import { expect, test } from './fixtures';
import { AuthPages } from './pages/auth';
import { BriefPages } from './pages/brief';
import { closeFixtureDb, projectWithRegisters, storedResult, succeededRun } from './pages/brief-fixture';
import { addMember, newOrganisation } from '../integration/helpers/http';
import { linkIn, waitForMail } from '@/scripts/fakes/mail/client';
import { formatMoney } from '@/lib/runs/format';

// The brief's known hydration error (see ./fixtures), on the brief only, until it is fixed.

const MEMBER_PASSWORD = 'another long password';

test.afterAll(closeFixtureDb);

test('an estimator sends the brief; the sponsor follows the e-mail, approves, and the trend shows the baseline', async ({
  page,
  browser,
}) => {
  const org = await newOrganisation('e2e-brief');
  const estimator = await addMember(org.client, 'estimator');
  const sponsor = await addMember(org.client, 'sponsor');
  const { projectId } = await projectWithRegisters(org.client);
  const runId = await succeededRun(estimator.client, projectId);
  const p80 = formatMoney((await storedResult(runId)).cost.percentiles.P80, 'EUR');

  // The estimator reads the brief and puts it before the sponsors.
  await new AuthPages(page).signIn(estimator.email, MEMBER_PASSWORD);
  await expect(page).toHaveURL(/\/projects$/);
  const estimatorBrief = new BriefPages(page);
  await estimatorBrief.open(projectId, runId);
  await expect(estimatorBrief.title()).toContainText('Harbour wall');
  await expect(page.getByTestId('row-P80')).toContainText(p80);
  await expect(page.getByRole('button', { name: 'Approve this baseline' })).toHaveCount(0);
  await estimatorBrief.sendToSponsors();
  await page.screenshot({ path: '/tmp/brief-estimator.png', fullPage: true });

  // The sponsor, signed out, follows the link in the e-mail the fake SMTP server caught.
  const [mail] = await waitForMail(sponsor.email, { kind: 'brief_ready' });
  const link = linkIn(mail, process.env.APP_URL ?? 'http://localhost:3100');
  expect(link).toContain(`/projects/${projectId}/runs/${runId}/brief`);
  const context = await browser.newContext();
  const sponsorPage = await context.newPage();
  await sponsorPage.goto(link);
  await expect(sponsorPage).toHaveURL(/\/sign-in/);
  await sponsorPage.getByLabel('E-mail').fill(sponsor.email);
  await sponsorPage.getByLabel('Password').fill(MEMBER_PASSWORD);
  await sponsorPage.getByRole('button', { name: 'Sign in' }).click();
  await expect(sponsorPage).toHaveURL(new RegExp(`/projects/${projectId}/runs/${runId}/brief$`));

  const brief = new BriefPages(sponsorPage);
  await expect(sponsorPage.getByTestId('p80-text')).toContainText(p80);
  await expect(sponsorPage.getByRole('button', { name: 'Send to sponsors for a decision' })).toHaveCount(0);
  await brief.approve('Fund at P80 for the feasibility gate.');
  await expect(brief.decisionRecord()).toContainText('Approved as the baseline by sponsor person');
  await expect(brief.decisionRecord()).toContainText('Fund at P80 for the feasibility gate.');
  await expect(sponsorPage.getByRole('button', { name: 'Approve this baseline' })).toHaveCount(0);
  await sponsorPage.screenshot({ path: '/tmp/brief-sponsor.png', fullPage: true });

  // The trend shows the new baseline, in the chart's table and as the current one.
  await brief.openTrend(projectId);
  await expect(sponsorPage.getByTestId('current-baseline')).toContainText('run 1'); // the project's first run
  await expect(sponsorPage.getByTestId('trend-table')).toContainText(p80);
  await expect(sponsorPage.getByTestId('trend-chart')).toBeVisible();
  await sponsorPage.screenshot({ path: '/tmp/brief-trend.png', fullPage: true });
  await context.close();
});

import { expect, test } from './fixtures';
import { AuthPages } from './pages/auth';

test('an owner sets a four-day week and imports holidays from a CSV file', async ({ page }) => {
  const auth = new AuthPages(page);
  const email = `calendar-${Date.now()}@test.example`;
  await auth.signUp({
    name: 'Cal Owner',
    organization: 'Calendar test works',
    email,
    password: 'a long enough password',
  });
  await expect(page).toHaveURL(/\/projects/);
  await page.getByRole('link', { name: 'Calendar' }).click();
  await expect(page.getByRole('heading', { name: 'Working calendar' })).toBeVisible();
  await expect(page.getByText('Work is counted Monday to Friday.')).toBeVisible();

  await page.getByLabel('Fri').uncheck();
  await expect(page.getByText('Work is counted Monday to Thursday.')).toBeVisible();
  await page.getByLabel('Import dates from a CSV file').setInputFiles({
    name: 'holidays-2027.csv',
    mimeType: 'text/csv',
    buffer: Buffer.from('date,name\n2027-12-27,Winter closure\n2027-12-28,Winter closure\n27/12/2027,Bad\n'),
  });
  await expect(
    page.getByText('Read 2 dates from holidays-2027.csv: 2 added. Save to keep them.'),
  ).toBeVisible();
  await expect(page.getByText('Line 4: "27/12/2027" is not a date written as YYYY-MM-DD')).toBeVisible();
  await expect(page.getByTestId('holiday-table').getByRole('row')).toHaveCount(3);
  await expect(page.getByText('Changes not saved yet.')).toBeVisible();

  await page.getByRole('button', { name: 'Save calendar' }).click();
  await expect(page.getByText('All changes saved.')).toBeVisible();
  await page.reload();
  await expect(page.getByText('Work is counted Monday to Thursday.')).toBeVisible();
  await page.getByLabel('Year').selectOption('2027');
  await expect(page.getByTestId('holiday-table')).toContainText('Winter closure');
});

import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { expect, test, type Browser, type Page, type TestInfo } from '@playwright/test';
import { checked, openApp, shot, verdictOf } from './helpers';

// A full two-round plan review in the browser, on the invented review sample (samples/review/round-1.json:
// the clinic riser as submitted, round 1 frozen; TAP-L3 is 2/0 Cu where a 25 ft tap from 600 A needs 200 A,
// and TAP-L2 relies on "other approved means", which only the AHJ can accept, 240.21(B)(2)).
const ROUND1 = readFileSync(fileURLToPath(new URL('../samples/review/round-1.json', import.meta.url)), 'utf8');
const AHJ_FINDING = 'tap-25ft:TAP-L2:other-approved-means';

async function person(browser: Browser, name: string, role: 'reviewer' | 'designer'): Promise<Page> {
  const page = await (await browser.newContext({ viewport: { width: 1600, height: 1000 }, acceptDownloads: true })).newPage();
  await openApp(page);
  await page.getByTestId('review-identity-name').fill(name);
  await page.getByTestId('review-identity-role').selectOption(role);
  await page.getByTestId('review-identity-save').click();
  await expect(page.getByTestId('review-author')).toHaveText(name);
  return page;
}

async function openText(page: Page, name: string, text: string): Promise<void> {
  await page.getByTestId('open-file-input').setInputFiles({ name, mimeType: 'application/json', buffer: Buffer.from(text) });
  await expect(page.getByTestId('notice').filter({ hasText: `Opened ${name}` }).last()).toBeVisible();
  await checked(page);
}

async function download(page: Page, testId: string, info: TestInfo, name: string): Promise<string> {
  const [d] = await Promise.all([page.waitForEvent('download'), page.getByTestId(testId).click()]);
  const path = info.outputPath(name);
  await d.saveAs(path);
  return path;
}

/** Selects a conductor through its finding in the findings list (which also frames it), as a reviewer reads down the list. */
async function selectByFinding(page: Page, conductorId: string): Promise<void> {
  await page.getByTestId('finding').filter({ hasText: `(${conductorId})` }).first().click();
  await expect(page.getByTestId('comment-target')).toHaveValue(`c:${conductorId}`);
}

const pdfText = (path: string) => execFileSync('pdftotext', ['-layout', path, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');

test('a two-round review: comment, accept, answer, fix, freeze, compare, close, letters', async ({ browser }, info) => {
  // Reviewer: opens the submittal in review mode.
  const reviewer = await person(browser, 'M. Ortiz', 'reviewer');
  await openText(reviewer, 'round-1.json', ROUND1);
  await reviewer.getByTestId('review-mode').check();
  await expect(reviewer.getByTestId('review-mode')).toBeChecked();
  // The drawing is read-only: an edit is refused with a notice and changes nothing.
  const before = await reviewer.evaluate(() => JSON.stringify(window.__linewright!.doc()));
  await selectByFinding(reviewer, 'TAP-L3');
  await reviewer.getByTestId('cmd-delete').click();
  await expect(reviewer.getByTestId('notice').filter({ hasText: 'read-only' })).toBeVisible();
  expect(await reviewer.evaluate(() => JSON.stringify(window.__linewright!.doc()))).toBe(before);

  // A comment on the tap conductor.
  await expect(reviewer.getByTestId('comment-target')).toHaveValue('c:TAP-L3');
  await reviewer.getByTestId('comment-text').fill('TAP-L3: 2/0 Cu is 175 A; a 25 ft tap from the 600 A riser needs 200 A. Upsize.');
  await reviewer.getByTestId('comment-add').click();
  await expect(reviewer.getByTestId('comment-pin').filter({ hasText: '1' })).toBeVisible();

  // A comment on the needs-AHJ finding, and the AHJ's acceptance of it.
  await selectByFinding(reviewer, 'TAP-L2');
  await reviewer.getByTestId('comment-target').selectOption(`f:${AHJ_FINDING}`);
  await reviewer.getByTestId('comment-text').fill('Steel cover over the tray accepted by the building official; cite the meeting note on the sheet.');
  await reviewer.getByTestId('comment-add').click();
  const form = reviewer.locator(`[data-testid="disposition"][data-finding="${AHJ_FINDING}"]`);
  await form.getByTestId('disposition-kind').selectOption('ahj-accepted');
  await form.getByTestId('disposition-ahj-name').fill('Building official, plan desk 3');
  await form.getByTestId('disposition-reference').fill('Meeting note 2026-114');
  await form.getByTestId('disposition-save').click();
  await expect(form.getByTestId('disposition-current')).toHaveAttribute('data-standing', 'stands');
  await expect(reviewer.getByTestId('comment')).toHaveCount(2);
  await shot(reviewer, info, 'reviewer-comments-and-acceptance');
  const reviewed = readFileSync(await download(reviewer, 'cmd-save', info, 'reviewed.json'), 'utf8');
  const saved = JSON.parse(reviewed);
  expect(saved.version).toBe(2);
  expect(saved.review.comments.map((c: { number: number; pin: { on: string } }) => [c.number, c.pin.on])).toEqual([[1, 'conductor'], [2, 'finding']]);
  expect(saved.review.dispositions[0]).toMatchObject({ findingId: AHJ_FINDING, kind: 'ahj-accepted', ahjName: 'Building official, plan desk 3' });

  // Designer: answers, fixes the conductor, freezes the resubmittal.
  const designer = await person(browser, 'K. Lindqvist', 'designer');
  await openText(designer, 'reviewed.json', reviewed);
  await expect(designer.getByTestId('review-mode')).not.toBeChecked();
  await designer.locator('[data-testid="comment"][data-number="1"]').click();
  await designer.getByTestId('comment-reply-text').fill('Resized TAP-L3 to 3/0 Cu (200 A); length unchanged at 24 ft.');
  await designer.getByTestId('comment-reply').click();
  await expect(designer.locator('[data-testid="comment"][data-number="1"]')).toHaveAttribute('data-state', 'answered');
  await selectByFinding(designer, 'TAP-L3');
  await designer.getByTestId('field-size').selectOption('3/0');
  await checked(designer);
  await expect(verdictOf(designer, 'TAP-L3')).toHaveAttribute('data-verdict', 'tap-25ft');
  await designer.getByTestId('round-name').fill('Resubmittal 2');
  await designer.getByTestId('round-freeze').click();
  await expect(designer.getByTestId('round')).toHaveCount(2);
  await shot(designer, info, 'designer-answered-and-resubmitted');
  const resubmitted = readFileSync(await download(designer, 'cmd-save', info, 'resubmitted.json'), 'utf8');

  // Reviewer: compares the rounds, sees the change on the drawing, closes the comment.
  await openText(reviewer, 'resubmitted.json', resubmitted);
  await expect(reviewer.getByTestId('compare-from')).toHaveValue('1');
  await expect(reviewer.getByTestId('compare-to')).toHaveValue('2');
  await reviewer.getByTestId('compare-run').click();
  const change = reviewer.locator('[data-testid="compare-change"][data-id="TAP-L3"]');
  await expect(change).toContainText('size 2/0 → 3/0');
  await expect(reviewer.getByTestId('compare-verdict')).toContainText('TAP-L3 unprotected → tap: 25 ft');
  await expect(reviewer.getByTestId('compare-resolved')).toHaveCount(1);
  await expect(reviewer.locator('[data-testid="change-mark"][data-id="TAP-L3"]')).toBeVisible();
  await reviewer.getByTestId('compare-next').or(change.getByRole('button')).first().click();
  await shot(reviewer, info, 'reviewer-compares-rounds');
  await reviewer.locator('[data-testid="comment"][data-number="1"]').click();
  await expect(reviewer.getByTestId('comment-reply-body')).toContainText('Resized TAP-L3 to 3/0 Cu');
  await reviewer.getByTestId('comment-move-closed').click();
  await reviewer.getByTestId('comment-filter-closed').check();
  await expect(reviewer.locator('[data-testid="comment"][data-number="1"]')).toHaveAttribute('data-state', 'closed');
  await shot(reviewer, info, 'reviewer-closed-comment');

  // The letter and the permit set carry the comments.
  const letter = pdfText(await download(reviewer, 'letter-pdf', info, 'comment-response-letter.pdf'));
  expect(letter).toContain('Comment-response letter');
  expect(letter).toContain('TAP-L3: 2/0 Cu is 175 A');
  expect(letter).toContain('Resized TAP-L3 to 3/0 Cu');
  expect(letter).toMatch(/C1 closed/);
  expect(letter).toContain('accepted by the AHJ');
  const csv = readFileSync(await download(reviewer, 'letter-csv', info, 'comment-response-letter.csv'), 'utf8');
  expect(csv.split('\r\n')[1]).toMatch(/^1,1,no,closed,conductor TAP-L3,/);
  await checked(reviewer);
  const permitPath = await download(reviewer, 'cmd-pdf', info, 'permit-set.pdf');
  const permit = pdfText(permitPath);
  expect(permit).toContain('Plan review comments');
  expect(permit).toContain('Steel cover over the tray accepted by the building official');
  expect(permit).toContain('REVISIONS (REVIEW ROUNDS)');
  expect(permit).toContain('Resubmittal 2');
  const png = info.outputPath('permit-set-page1');
  execFileSync('pdftoppm', ['-png', '-singlefile', '-r', '70', '-f', '1', '-l', '1', permitPath, png]);
  await info.attach('permit-set page 1', { path: `${png}.png`, contentType: 'image/png' });
});

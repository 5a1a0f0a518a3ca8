/// <reference lib="dom" />
/**
 * A lesson through the real UI: the demo teacher builds a lesson around the demo's front at Kestrel Ridge,
 * accepts the front candidate, marks it with a box on the chart, adds a question and shares the lesson. The link
 * opens in a fresh browser context with no account, the answer hidden until revealed, the page passes axe-core
 * and prints to an A4 PDF of one or two pages holding the lesson's text but not the answer.
 */
import { rmSync } from 'node:fs';
import { join } from 'node:path';
import { DEMO_PASSWORD } from '../../server/demo/demo-scenario';
import type { RunningServer } from '../../server/server';
import { seriousAxeViolations } from '../helpers/axe';
import { chooseOption, launchChromium, signIn, type BrowserSession } from '../helpers/browser';
import { startE2eServer } from '../helpers/e2e-server';
import { readPdfText } from '../helpers/pdf-text';

const NOTE_TEXT = 'The pressure bottoms out, then climbs fast behind the front.';
const QUESTION = 'At what time did the front pass Kestrel Ridge?';
const ANSWER = 'Near the lowest pressure, on Tuesday afternoon.';

jest.setTimeout(240_000);

describe('a lesson from the demo front to a shared, printed handout', () => {
  let workDir: string;
  let server: RunningServer;
  let chromium: BrowserSession;

  beforeAll(async () => {
    ({ server, workDir } = await startE2eServer('lesson'));
    chromium = await launchChromium();
  });

  afterAll(async () => {
    await chromium?.close();
    await server?.close();
    rmSync(workDir, { recursive: true, force: true });
  });

  it('when a teacher builds and shares a lesson, then a pupil opens it without an account, reveals the answer and the handout prints', async () => {
    const teacher = await chromium.browser.newPage({ viewport: { width: 1400, height: 1000 } });

    // Act 1: the teacher's home is Lessons; a new lesson over three days of Kestrel Ridge.
    await signIn(teacher, server.url, 'teacher@isallo.test', DEMO_PASSWORD);
    await teacher.getByTestId('nav-lessons').waitFor();
    expect(await teacher.getByTestId('nav-series').count()).toBe(1);
    expect(new URL(teacher.url()).pathname).toBe('/lessons');
    await teacher.getByTestId('lesson-new').click();
    await teacher.getByTestId('new-lesson-title').fill('A cold front at Kestrel Ridge');
    await teacher.getByTestId('new-lesson-audience').fill('Year 10');
    await chooseOption(teacher, 'new-lesson-station', 'Kestrel Ridge Observatory (KRO)');
    await teacher.getByTestId('new-lesson-from').fill('2026-03-02T12:00Z');
    await teacher.getByTestId('new-lesson-to').fill('2026-03-05T00:00Z');
    await teacher.getByTestId('new-lesson-create').click();

    // Act 2: accept the front candidate, write the note and mark a box on the chart around the trough.
    await teacher.getByTestId('candidate-row').first().waitFor();
    await teacher.getByTestId('chart-region-image').first().waitFor();
    const frontRow = teacher.getByTestId('candidate-row').filter({ hasText: 'Front candidate' });
    await frontRow.getByTestId('candidate-accept').click();
    await teacher.getByTestId('note-form').waitFor();
    await teacher.getByTestId('note-text').fill(NOTE_TEXT);
    await teacher.getByTestId('note-mark-box').click();
    const overlay = await teacher.getByTestId('chart-region-overlay').first().boundingBox();
    if (!overlay) throw new Error('the chart region is not on screen');
    await teacher.mouse.click(overlay.x + overlay.width * 0.44, overlay.y + overlay.height * 0.35);
    await teacher.mouse.click(overlay.x + overlay.width * 0.52, overlay.y + overlay.height * 0.9);
    await teacher.getByTestId('note-mark-text').filter({ hasText: 'A box on the chart' }).waitFor();
    await teacher.getByTestId('note-save').click();
    await teacher.getByTestId('note-form').waitFor({ state: 'detached' });

    // Act 2b: dismiss the pressure jump candidate, take the dismissal back, then dismiss it for good.
    const jumpRow = teacher.getByTestId('candidate-row').filter({ hasText: 'Pressure jump candidate' });
    await jumpRow.getByTestId('candidate-dismiss').click();
    await jumpRow.getByTestId('candidate-reopen').click();
    await jumpRow.getByTestId('candidate-accept').waitFor();
    expect(await jumpRow.getAttribute('data-decision')).toBe('open');
    await jumpRow.getByTestId('candidate-dismiss').click();
    await jumpRow.getByTestId('candidate-reopen').waitFor();

    // Act 3: a question with its answer, then a share link.
    await teacher.getByTestId('question-text').fill(QUESTION);
    await teacher.getByTestId('question-answer').fill(ANSWER);
    await teacher.getByTestId('question-add').click();
    await teacher.getByTestId('question-row').waitFor();
    await teacher.getByTestId('share-create').click();
    const link = (await teacher.getByTestId('share-link').first().getAttribute('href')) as string;

    // Assert the teacher's side: the note came from the candidate, with its derived values and its mark.
    expect(await frontRow.getAttribute('data-decision')).toBe('accepted');
    expect(await jumpRow.getAttribute('data-decision')).toBe('dismissed');
    const noteRow = teacher.getByTestId('note-row').first();
    expect(await noteRow.textContent()).toContain(NOTE_TEXT);
    expect(await noteRow.getByTestId('note-derived').textContent()).toMatch(/3-hour tendency .+ characteristic \d \(group 5\d{4}\)/);
    expect(await teacher.getByTestId('chart-mark').count()).toBe(1);
    expect(await teacher.getByTestId('plot-note').count()).toBe(1);
    expect(link).toMatch(new RegExp(`^${server.url}/shared/[A-Za-z0-9_-]{43}$`));
    expect(await seriousAxeViolations(teacher)).toEqual([]);

    // Act 4: a pupil on a phone, in a fresh context without any sign-in.
    const pupilContext = await chromium.browser.newContext({ viewport: { width: 390, height: 844 } });
    const pupil = await pupilContext.newPage();
    const response = await pupil.goto(link);
    await pupil.getByTestId('lesson-view-title').waitFor();
    await pupil.waitForFunction(() => {
      const image = document.querySelector<HTMLImageElement>('[data-testid="chart-region-image"]');
      return image !== null && image.complete && image.naturalWidth > 0;
    });

    // Assert: the lesson is there and nothing else; the answer stays hidden until revealed.
    expect(response?.headers()['x-robots-tag']).toMatch(/noindex/);
    expect(await pupil.locator('meta[name="robots"]').getAttribute('content')).toMatch(/noindex/);
    expect(await pupil.evaluate(() => sessionStorage.length + localStorage.length)).toBe(0);
    expect(await pupil.getByTestId('sign-out').count()).toBe(0);
    expect(await pupil.getByTestId('lesson-view-title').textContent()).toBe('A cold front at Kestrel Ridge');
    expect(await pupil.getByTestId('lesson-view-note').first().textContent()).toContain(NOTE_TEXT);
    expect(await pupil.getByTestId('chart-mark').count()).toBe(1);
    expect(await pupil.getByText(ANSWER).count()).toBe(0);
    const plotLabel = (await pupil.getByTestId('lesson-plot').getAttribute('aria-label')) as string;
    expect(plotLabel).toContain(`Notes in time order: Cold front, Tue 3 Mar 2026 15:00 UTC: ${NOTE_TEXT}`);
    expect(await pupil.getByTestId('chart-region-image').getAttribute('alt')).toContain(NOTE_TEXT);
    const pageWidth = await pupil.evaluate(() => document.documentElement.scrollWidth);
    expect(pageWidth).toBeLessThanOrEqual(390);
    expect(await seriousAxeViolations(pupil)).toEqual([]);
    await pupil.getByTestId('lesson-view-reveal').click();
    expect(await pupil.getByTestId('lesson-view-answer').textContent()).toBe(ANSWER);

    // Act 5: the handout, printed to A4 by Chromium's print style sheet.
    const pdfPath = join(workDir, 'handout.pdf');
    await pupil.pdf({ path: pdfPath, format: 'A4', printBackground: true });
    const pdf = await readPdfText(pdfPath);
    const text = pdf.pages.join(' ');

    expect(pdf.pageCount).toBeGreaterThanOrEqual(1);
    expect(pdf.pageCount).toBeLessThanOrEqual(2);
    expect(text).toContain('A cold front at Kestrel Ridge');
    expect(text).toContain(NOTE_TEXT);
    expect(text).toContain(QUESTION);
    expect(text).toContain('The chart the instrument drew');
    expect(text).toContain('Station series of Kestrel Ridge Observatory (KRO)');
    expect(text).toContain('not for aviation altimeter settings or navigation');
    expect(text).not.toContain(ANSWER);
    expect(text).not.toContain('Show the answer');
    expect(text).not.toContain('Print the handout');
    await pupilContext.close();

    // Act 6: the teacher's own handout prints without the app's toolbar and navigation.
    await teacher.getByTestId('lesson-handout').click();
    await teacher.getByTestId('lesson-view-title').waitFor();
    const teacherPdfPath = join(workDir, 'teacher-handout.pdf');
    await teacher.pdf({ path: teacherPdfPath, format: 'A4', printBackground: true });
    const teacherPdf = await readPdfText(teacherPdfPath);
    const teacherText = teacherPdf.pages.join(' ');

    expect(teacherPdf.pageCount).toBeLessThanOrEqual(2);
    expect(teacherText).toContain(NOTE_TEXT);
    expect(teacherText).not.toContain('Sign out');
    expect(teacherText).not.toContain('Back to the lesson');
  });
});

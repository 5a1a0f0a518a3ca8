import fs from 'node:fs/promises';
import path from 'node:path';
import type { CapturedMail } from '@shared/api/mail';

/**
 * The mails the local SMTP fake (scripts/lib/mail-fake.ts) wrote to its folder, newest first. File names
 * start with the instant received, so sorting the names sorts the mails.
 */
export async function listCapturedMails(captureDir: string, page: { page: number; pageSize: number }): Promise<{ items: CapturedMail[]; total: number }> {
  let names: string[];
  try {
    names = (await fs.readdir(captureDir)).filter((name) => name.endsWith('.json') && !name.startsWith('.'));
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return { items: [], total: 0 };
    throw error;
  }
  names.sort().reverse();
  const slice = names.slice(page.page * page.pageSize, (page.page + 1) * page.pageSize);
  const items = await Promise.all(slice.map(async (name) => JSON.parse(await fs.readFile(path.join(captureDir, name), 'utf8')) as CapturedMail));
  return { items, total: names.length };
}

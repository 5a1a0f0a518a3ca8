import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';

const ROOT = resolve(__dirname, '..', '..');
const DOCS = ['README.md', 'DEVELOPERS.md', 'server/README.md', ...readdirSync(join(ROOT, 'docs')).filter((name) => name.endsWith('.md')).map((name) => `docs/${name}`)];
/** Markdown links `[text](target)`; the target stops at whitespace or the closing parenthesis. */
const LINK = /\]\(([^)\s]+)(?:\s+"[^"]*")?\)/g;

function relativeLinks(file: string): string[] {
  const text = readFileSync(join(ROOT, file), 'utf8');
  return [...text.matchAll(LINK)].map((match) => match[1]).filter((target) => !/^(https?:|mailto:|#)/.test(target));
}

function filesUnder(dir: string, ext: string): string[] {
  return readdirSync(join(ROOT, dir), { withFileTypes: true, recursive: true })
    .filter((entry) => entry.isFile() && entry.name.endsWith(ext))
    .map((entry) => relative(ROOT, join(entry.parentPath, entry.name)));
}

describe('the docs resolve in a clone', () => {
  it.each(DOCS)('when %s links to a file, then the file is in the repository', (file) => {
    const broken = relativeLinks(file).filter((target) => {
      const path = resolve(ROOT, dirname(file), decodeURIComponent(target.split('#')[0]));
      return target.startsWith('/') || relative(ROOT, path).startsWith('..') || !existsSync(path);
    });

    expect(broken).toEqual([]);
  });

  it('when code cites docs/references.md §N, then that section exists', () => {
    const references = readFileSync(join(ROOT, 'docs', 'references.md'), 'utf8');
    const sections = new Set([...references.matchAll(/^## (§\d+)/gm)].map((match) => match[1]));
    const cited = ['shared', 'server', 'test', 'scripts']
      .flatMap((dir) => filesUnder(dir, '.ts'))
      .flatMap((file) => [...readFileSync(join(ROOT, file), 'utf8').matchAll(/docs\/references\.md (§\d+)/g)].map((match) => `${file} ${match[1]}`));

    expect(cited.length).toBeGreaterThan(10);
    expect(cited.filter((citation) => !sections.has(citation.split(' ')[1]))).toEqual([]);
  });

  it('when code cites a table of docs/references.md, then the table is there', () => {
    const references = readFileSync(join(ROOT, 'docs', 'references.md'), 'utf8');

    expect(references).toContain('**Table 1.1**');
  });
});

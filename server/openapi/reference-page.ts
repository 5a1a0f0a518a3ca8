import type { buildOpenApiDocument } from './openapi-document';

type Document = ReturnType<typeof buildOpenApiDocument>;

const escapeHtml = (text: string) => text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

/** A plain HTML reference of the description: each route with its parameters and answers, then the schemas as JSON. */
export function referencePage(document: Document): string {
  const sections: string[] = [];
  for (const [path, item] of Object.entries(document.paths ?? {})) {
    for (const [method, operation] of Object.entries(item as Record<string, { summary?: string; description?: string; parameters?: { name: string; in: string; required?: boolean; description?: string }[]; responses?: Record<string, { description?: string }> }>)) {
      const parameters = (operation.parameters ?? [])
        .map((parameter) => `<li><code>${escapeHtml(parameter.name)}</code> (${parameter.in}${parameter.required ? ', required' : ''}) ${escapeHtml(parameter.description ?? '')}</li>`)
        .join('');
      const responses = Object.entries(operation.responses ?? {})
        .map(([status, response]) => `<li><code>${status}</code> ${escapeHtml(response.description ?? '')}</li>`)
        .join('');
      sections.push(
        `<section><h2><code>${method.toUpperCase()} ${escapeHtml(path)}</code></h2><p>${escapeHtml(operation.summary ?? '')}</p>` +
          `${operation.description ? `<p>${escapeHtml(operation.description)}</p>` : ''}` +
          `${parameters ? `<h3>Parameters</h3><ul>${parameters}</ul>` : ''}<h3>Answers</h3><ul>${responses}</ul></section>`,
      );
    }
  }
  const schemas = Object.entries(document.components?.schemas ?? {})
    .map(([name, schema]) => `<section><h3 id="${escapeHtml(name)}">${escapeHtml(name)}</h3><pre>${escapeHtml(JSON.stringify(schema, null, 2))}</pre></section>`)
    .join('');
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Isallo API reference</title>
<style>body{font-family:system-ui,sans-serif;max-width:60rem;margin:2rem auto;padding:0 1rem;line-height:1.5}pre{background:#f4f1ea;padding:1rem;overflow:auto}code{background:#f4f1ea}</style></head>
<body><h1>Isallo API reference</h1><p>${escapeHtml(document.info.description ?? '')} Machine-readable: <a href="/api/openapi.json">/api/openapi.json</a> (OpenAPI ${escapeHtml(document.openapi)}).</p>
${sections.join('\n')}<h2>Schemas</h2>${schemas}</body></html>`;
}

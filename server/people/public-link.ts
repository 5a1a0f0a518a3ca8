import type { Config } from '../config';

/** An absolute link to a client page, on the configured public base URL (never the request's Host header). */
export function publicLink(config: Pick<Config, 'publicUrl'>, pagePath: string): string {
  return `${config.publicUrl}${pagePath}`;
}

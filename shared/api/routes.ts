/** Every API path, relative to the server root. The client and server both import these. */
export const API = {
  signIn: '/api/auth/sign-in',
  me: '/api/auth/me',
  stations: '/api/stations',
  chartForms: '/api/chart-forms',
  scans: '/api/scans',
  scan: (scanId: string) => `/api/scans/${encodeURIComponent(scanId)}`,
  scanPreview: (scanId: string) => `/api/scans/${encodeURIComponent(scanId)}/preview`,
  scanInkLines: (scanId: string) => `/api/scans/${encodeURIComponent(scanId)}/ink-lines`,
  series: '/api/series',
  seriesCsv: '/api/series.csv',
  people: '/api/people',
  health: '/api/health',
} as const;

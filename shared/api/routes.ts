const enc = encodeURIComponent;

/** Every API path, relative to the server root. The client and server both import these. */
export const API = {
  signIn: '/api/auth/sign-in',
  me: '/api/auth/me',
  stations: '/api/stations',
  station: (stationId: string) => `/api/stations/${enc(stationId)}`,
  stationInstruments: (stationId: string) => `/api/stations/${enc(stationId)}/instruments`,
  instrument: (instrumentId: string) => `/api/instruments/${enc(instrumentId)}`,
  chartForms: '/api/chart-forms',
  chartForm: (chartFormId: string) => `/api/chart-forms/${enc(chartFormId)}`,
  /** The change logs of the registers (archivists and admins). */
  stationChangeLog: (stationId: string) => `/api/stations/${enc(stationId)}/change-log`,
  instrumentChangeLog: (instrumentId: string) => `/api/instruments/${enc(instrumentId)}/change-log`,
  chartFormChangeLog: (chartFormId: string) => `/api/chart-forms/${enc(chartFormId)}/change-log`,
  intakeBatches: '/api/intake/batches',
  intakeBatch: (batchId: string) => `/api/intake/batches/${enc(batchId)}`,
  intakeBatchFiles: (batchId: string) => `/api/intake/batches/${enc(batchId)}/files`,
  intakeBatchInventory: (batchId: string) => `/api/intake/batches/${enc(batchId)}/inventory`,
  scans: '/api/scans',
  scanStatusCounts: '/api/scans/status-counts',
  scanBulkEdit: '/api/scans/bulk-edit',
  scan: (scanId: string) => `/api/scans/${enc(scanId)}`,
  scanStatus: (scanId: string) => `/api/scans/${enc(scanId)}/status`,
  scanChangeLog: (scanId: string) => `/api/scans/${enc(scanId)}/change-log`,
  scanDerivativesRetry: (scanId: string) => `/api/scans/${enc(scanId)}/derivatives/retry`,
  scanPreview: (scanId: string) => `/api/scans/${enc(scanId)}/preview`,
  scanInkLines: (scanId: string) => `/api/scans/${enc(scanId)}/ink-lines`,
  /** The caller's draft on a scan (PUT autosaves it). */
  scanDraft: (scanId: string) => `/api/scans/${enc(scanId)}/ink-lines/draft`,
  /** The caller's own line on a scan: the draft to resume, or the line handed in. */
  scanMyInkLine: (scanId: string) => `/api/scans/${enc(scanId)}/ink-lines/mine`,
  /** The caller's lines across scans, paged ("My drafts" on the Desk). */
  myInkLines: '/api/ink-lines/mine',
  scanFollowInk: (scanId: string) => `/api/scans/${enc(scanId)}/follow-ink`,
  review: '/api/review',
  inkLineReview: (inkLineId: string) => `/api/ink-lines/${enc(inkLineId)}/review`,
  inkLineApprove: (inkLineId: string) => `/api/ink-lines/${enc(inkLineId)}/approve`,
  inkLineReturn: (inkLineId: string) => `/api/ink-lines/${enc(inkLineId)}/return`,
  inkLineRework: (inkLineId: string) => `/api/ink-lines/${enc(inkLineId)}/rework`,
  inkLineChangeLog: (inkLineId: string) => `/api/ink-lines/${enc(inkLineId)}/change-log`,
  deskSummary: '/api/desk/summary',
  deskLines: '/api/desk/lines',
  deskNext: '/api/desk/next',
  deskClaim: (scanId: string) => `/api/desk/claims/${enc(scanId)}`,
  tracingProgress: '/api/tracing/progress',
  tracingPriorities: '/api/tracing/priorities',
  stationTracing: (stationId: string) => `/api/tracing/stations/${enc(stationId)}`,
  series: '/api/series',
  seriesCsv: '/api/series.csv',
  /** Steps, aggregates, flags, several stations, JSON / CSV / CF NetCDF. */
  seriesQuery: '/api/series/query',
  seriesPointChart: '/api/series/point-chart',
  stationCoverage: (stationId: string) => `/api/stations/${enc(stationId)}/coverage`,
  apiTokens: '/api/tokens',
  apiToken: (tokenId: string) => `/api/tokens/${enc(tokenId)}`,
  openApi: '/api/openapi.json',
  apiReference: '/api/reference',
  people: '/api/people',
  person: (personId: string) => `/api/people/${enc(personId)}`,
  peopleChanges: '/api/people/changes',
  invitations: '/api/invitations',
  invitation: (invitationId: string) => `/api/invitations/${enc(invitationId)}`,
  invitationResend: (invitationId: string) => `/api/invitations/${enc(invitationId)}/resend`,
  /** The invitee's side, with the link's secret and no sign-in: GET shows the invitation, POST …/accept takes it. */
  invitationByToken: (token: string) => `/api/auth/invitations/${enc(token)}`,
  invitationAccept: (token: string) => `/api/auth/invitations/${enc(token)}/accept`,
  myPassword: '/api/auth/me/password',
  signOutEverywhere: '/api/auth/me/sign-out-everywhere',
  passwordResetRequests: '/api/auth/password-reset-requests',
  passwordResets: '/api/auth/password-resets',
  lessons: '/api/lessons',
  lesson: (lessonId: string) => `/api/lessons/${enc(lessonId)}`,
  lessonCopy: (lessonId: string) => `/api/lessons/${enc(lessonId)}/copy`,
  lessonPassage: (lessonId: string) => `/api/lessons/${enc(lessonId)}/passage`,
  lessonAnnotations: (lessonId: string) => `/api/lessons/${enc(lessonId)}/annotations`,
  lessonShares: (lessonId: string) => `/api/lessons/${enc(lessonId)}/shares`,
  lessonShare: (lessonId: string, shareId: string) => `/api/lessons/${enc(lessonId)}/shares/${enc(shareId)}`,
  /** What a share link shows, with no sign-in; its chart regions are under it (see LessonPassage.regions). */
  sharedLesson: (token: string) => `/api/shared/${enc(token)}`,
  /** Mails the local SMTP fake captured (development only, admin). */
  capturedMails: '/api/dev/mails',
  health: '/api/health',
} as const;

/** IIIF paths (outside /api; Bearer token as for the API). */
export const IIIF = {
  /** Image API 3.0 base URI of a scan (the `id` of its info.json); GET on it redirects (303) to info.json. */
  imageBase: (scanId: string) => `/iiif/3/${enc(scanId)}`,
  info: (scanId: string) => `/iiif/3/${enc(scanId)}/info.json`,
  /** An image request, e.g. iiifImage(id, 'full', '!2400,2400') → …/full/!2400,2400/0/default.jpg. */
  image: (scanId: string, region = 'full', size = 'max', rotation = '0', quality = 'default', format = 'jpg') =>
    `/iiif/3/${enc(scanId)}/${region}/${size}/${rotation}/${quality}.${format}`,
  /** Presentation API 3.0 manifest of one scan. */
  manifest: (scanId: string) => `/iiif/3/${enc(scanId)}/manifest`,
  /** Presentation API 3.0 collection of the manifests of one archival box. */
  boxCollection: (collection: string, box: string) => `/iiif/collection/box/${enc(collection)}/${enc(box)}`,
} as const;

/** Size of the IIIF tiles the worker makes, px. */
export const IIIF_TILE_SIZE_PX = 512;

/** Client pages that mails link to (relative to the public base URL). */
export const PAGES = {
  invitation: (token: string) => `/invitation/${enc(token)}`,
  passwordReset: (token: string) => `/reset-password/${enc(token)}`,
} as const;

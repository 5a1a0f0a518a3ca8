/** Every error code the API can answer with; the body is always ApiErrorBody. */
export type ApiErrorCode =
  | 'bad_request'
  | 'validation_failed'
  | 'unauthenticated'
  | 'token_expired'
  | 'forbidden'
  | 'not_found'
  | 'scan_not_found'
  | 'station_not_found'
  | 'chart_form_not_found'
  | 'instrument_not_found'
  | 'intake_batch_not_found'
  | 'duplicate_scan'
  | 'unsupported_file_type'
  | 'file_too_large'
  | 'corrupt_image'
  /** The image's pixel count would exhaust memory (a decompression bomb); refused before decoding. */
  | 'image_too_large'
  /** A PDF that is encrypted or has no pages. */
  | 'unreadable_pdf'
  | 'registration_failed'
  | 'lesson_not_found'
  /** A share link that does not exist, has expired or was revoked (the three are not told apart). */
  | 'share_link_not_found'
  /** A series range longer than the step allows; details give the limit and a coarser step. */
  | 'series_range_too_large'
  /** An API token (not a sign-in) on a route that tokens do not open, or on a write. */
  | 'api_token_not_allowed'
  /** A NetCDF file asked for a range with no points: there is nothing to write. */
  | 'series_empty'
  | 'api_token_not_found'
  | 'rate_limited'
  | 'version_conflict'
  | 'conflict'
  | 'internal_error';

export interface ApiErrorBody {
  error: {
    code: ApiErrorCode;
    message: string;
    /** Field-level problems, keyed by a dotted path such as `pins.2.pressure`. */
    details?: Record<string, string> | unknown;
  };
}

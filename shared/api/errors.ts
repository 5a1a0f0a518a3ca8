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
  | 'ink_line_not_found'
  /** Approve or return asked of an ink line that is not waiting for review (a draft, or already decided). */
  | 'ink_line_not_handed_in'
  /** Rework asked of an ink line that was not returned. */
  | 'ink_line_not_returned'
  /** Only the volunteer who traced a line may rework it. */
  | 'not_ink_line_author'
  /** A decision on an ink line of a withdrawn scan; restore the scan first. */
  | 'scan_withdrawn'
  /** The scan's traced / approved status follows its ink lines; it is not set by hand. */
  | 'scan_status_follows_ink_lines'
  /** Hand-in checks: each names the pins or knots at fault in details. */
  | 'pin_outside_image'
  | 'knot_outside_image'
  | 'knots_out_of_time_order'
  | 'span_outside_drum_period'
  | 'pin_rms_over_limit'
  /** The volunteer already handed in a line of this chart; a cross-trace must come from someone else. */
  | 'own_chart_cross_trace'
  /** The volunteer's earlier line of this chart was returned: rework that one instead of starting another. */
  | 'rework_returned_line_first'
  /** The chart already has as many independent ink lines as its station needs. */
  | 'chart_fully_traced'
  | 'claim_not_found'
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

/** Every error code the API can answer with; the body is always ApiErrorBody. */
export type ApiErrorCode =
  | 'bad_request'
  | 'validation_failed'
  | 'unauthenticated'
  | 'token_expired'
  /** A well-signed token whose session was ended (signed out everywhere, roles or password changed, account disabled or removed). */
  | 'session_ended'
  /** Sign-in with the right password to an account an admin has disabled. */
  | 'account_disabled'
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
  /** An invitation (or an account) for an address that already has an account. */
  | 'email_taken'
  /** A second invitation for an address whose invitation is still open. */
  | 'invitation_open'
  /** Resend or withdraw of an invitation already accepted or withdrawn. */
  | 'invitation_closed'
  | 'invitation_not_found'
  /** An invitation link that was used, withdrawn, replaced or has expired (not told apart). */
  | 'invitation_link_not_found'
  /** A password reset link that was used, replaced or has expired (not told apart). */
  | 'reset_link_not_found'
  | 'person_not_found'
  /** A change that would leave no enabled admin. */
  | 'last_admin'
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
  /** The volunteer's earlier line of this chart was returned: rework that one instead of starting another. */
  | 'rework_returned_line_first'
  /** The chart already has as many independent ink lines as its station needs. */
  | 'chart_fully_traced'
  | 'claim_not_found'
  /** A series range longer than the step allows; details give the limit and a coarser step. */
  | 'series_range_too_large'
  /** An API token (not a sign-in) on a route that tokens do not open, or on a write. */
  | 'api_token_not_allowed'
  /** A NetCDF file asked for a range with no points: there is nothing to write. */
  | 'series_empty'
  | 'api_token_not_found'
  | 'rate_limited'
  /** No mail server is set up, or it refused the mail. */
  | 'mail_unavailable'
  /** A shared edit carried a version that is no longer the stored one. */
  | 'version_conflict'
  | 'chart_form_name_taken'
  /** A chart form that scans use keeps its geometry: their tracing depends on it. */
  | 'chart_form_in_use'
  /** Another station has this code or WIGOS id. */
  | 'station_identifier_taken'
  /** The scan already has the status asked for. */
  | 'status_unchanged'
  /** The scan's status cannot move to the one asked for (details list the allowed moves). */
  | 'status_move_not_allowed'
  /** The scan lacks what tracing needs (details list the missing fields). */
  | 'scan_incomplete'
  /** Station, chart form and chart start of a traced or approved scan are what its ink line was read with. */
  | 'scan_fields_locked'
  /** The scan's status does not allow tracing (only ready to trace and traced scans are traced). */
  | 'scan_not_traceable'
  /** Only failed derivatives can be retried. */
  | 'derivatives_not_failed'
  /** The page image or tiles of the scan are not made yet. */
  | 'derivatives_not_ready'
  /** The Bench's draft changed on the server (another tab or window) since this page last saved it. */
  | 'draft_version_conflict'
  /** The volunteer has already handed in a line for this scan. */
  | 'already_handed_in'
  | 'internal_error';

export interface ApiErrorBody {
  error: {
    code: ApiErrorCode;
    message: string;
    /** Field-level problems, keyed by a dotted path such as `pins.2.pressure`. */
    details?: Record<string, string> | unknown;
  };
}

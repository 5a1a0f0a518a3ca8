/** The caution shown beside every derived number (pressure altitude, altimeter setting, sea-level pressure, tendency, fronts). */
export const DERIVED_CAUTION =
  'Derived from a digitized barogram for research and teaching only, not for aviation or navigation. ' +
  'Defer to official observations and local rules.';

import type { Role } from '@shared/api/roles';
import type { StationInput } from '@shared/api/stations';
import type { ChartForm } from '@shared/domain/chart-form';
import { GENERATED_DAILY_FORM } from '../../fixtures/generator/daily-form';
import { GENERATED_WEEKLY_FORM } from '../../fixtures/generator/weekly-form';

/** Password of every demo account (invented scenario; never use outside a demo). */
export const DEMO_PASSWORD = 'isallo-demo';

export const DEMO_PEOPLE: { email: string; displayName: string; roles: Role[] }[] = [
  { email: 'admin@isallo.test', displayName: 'Maren Tolvik', roles: ['admin'] },
  { email: 'archivist@isallo.test', displayName: 'Idris Fenwhistle', roles: ['archivist'] },
  { email: 'volunteer@isallo.test', displayName: 'Pia Castellane', roles: ['volunteer'] },
  { email: 'climatologist@isallo.test', displayName: 'Oskar Lindqvist-Hale', roles: ['climatologist'] },
  { email: 'teacher@isallo.test', displayName: 'Nell Ambrose', roles: ['teacher'] },
];

/** Invented places. */
export const DEMO_STATIONS: StationInput[] = [
  {
    code: 'KRO',
    name: 'Kestrel Ridge Observatory',
    latitude: 54.612,
    longitude: -2.871,
    elevationM: 412,
    timeZone: 'Europe/London',
    wigosId: null,
    barometerHeightM: 413.2,
    timeStandard: 'utc',
    historyNotes: 'Hill-top observatory; barograph moved to the north room in 1952 (invented).',
  },
  {
    code: 'SBS',
    name: 'Saltmere Bay School',
    latitude: 50.734,
    longitude: -3.405,
    elevationM: 18,
    timeZone: 'Europe/London',
    wigosId: null,
    barometerHeightM: 19.5,
    timeStandard: 'local_standard',
    historyNotes: 'School weather club; charts changed on Monday mornings (invented).',
  },
];

/** Used when the generated sample's own chart form is not there: the geometry the generator draws. */
export const DEMO_WEEKLY_FORM_FALLBACK: ChartForm = { ...GENERATED_WEEKLY_FORM, name: 'Weekly 950–1050 hPa' };

/** An invented daily form: one turn in 26 h (a day plus overlap for late changes), 15-minute arcs; the generator draws it. */
export const DEMO_DAILY_FORM: ChartForm = { ...GENERATED_DAILY_FORM, name: 'Daily 950–1050 hPa' };

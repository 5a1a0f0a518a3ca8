import { type Kysely, sql } from 'kysely';

/**
 * The instant of the chart's first printed time line is called chart start everywhere (it is not chart on,
 * the time the observer fitted the chart). The span trigger names the column, so it is made anew.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await renameChartStart(db, 'period_start', 'chart_start');
}

export async function down(db: Kysely<any>): Promise<void> {
  await renameChartStart(db, 'chart_start', 'period_start');
}

async function renameChartStart(db: Kysely<any>, from: string, to: string): Promise<void> {
  await sql`drop trigger scan_span on scan`.execute(db);
  await sql`alter table scan rename column ${sql.ref(from)} to ${sql.ref(to)}`.execute(db);
  await sql`
    create or replace function scan_set_span() returns trigger language plpgsql as $$
    declare
      drum_hours double precision;
    begin
      select chart_form.drum_hours into drum_hours from chart_form where chart_form.id = new.chart_form_id;
      new.span_start := coalesce(new.${sql.raw(to)}, new.chart_on);
      new.span_end := coalesce(new.chart_off, new.span_start + make_interval(secs => coalesce(drum_hours, 0) * 3600));
      return new;
    end $$`.execute(db);
  await sql`
    create trigger scan_span before insert or update of ${sql.ref(to)}, chart_on, chart_off, chart_form_id on scan
    for each row execute function scan_set_span()`.execute(db);
}

import { type Kysely, sql } from 'kysely';

/**
 * The catalogue fields of a scan. Station, chart form and period become optional (a scan may arrive
 * before its metadata); a multi-page master gives one scan per page, so uniqueness moves to (sha256, page_index).
 * span_start/span_end (kept by a trigger) are the chart's time span for the catalogue's date-range filter:
 * [period_start or chart_on, chart_off or start + the form's drum hours].
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable('scan')
    .alterColumn('station_id', (c) => c.dropNotNull())
    .alterColumn('chart_form_id', (c) => c.dropNotNull())
    .alterColumn('period_start', (c) => c.dropNotNull())
    .execute();
  await db.schema
    .alterTable('scan')
    .addColumn('page_index', 'integer', (c) => c.notNull().defaultTo(0).check(sql`page_index >= 0`))
    .addColumn('page_count', 'integer', (c) => c.notNull().defaultTo(1).check(sql`page_count >= 1`))
    .addColumn('batch_id', 'uuid', (c) => c.references('intake_batch.id').onDelete('set null'))
    .addColumn('instrument_id', 'uuid', (c) => c.references('instrument.id'))
    .addColumn('chart_on', 'timestamptz')
    .addColumn('chart_off', 'timestamptz')
    .addColumn('observer', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('collection', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('box', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('folder', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('item', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('condition_notes', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('notes', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('tags', sql`text[]`, (c) => c.notNull().defaultTo(sql`'{}'`))
    .addColumn('transcription', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('withdrawn_reason', 'text')
    .addColumn('dpi', 'double precision', (c) => c.check(sql`dpi > 0`))
    .addColumn('orientation', 'smallint', (c) => c.check(sql`orientation between 1 and 8`))
    .addColumn('version', 'integer', (c) => c.notNull().defaultTo(1))
    .addColumn('derivative_state', 'text', (c) =>
      c.notNull().defaultTo('queued').check(sql`derivative_state in ('queued', 'working', 'ready', 'failed')`),
    )
    .addColumn('derivative_error', 'text')
    .addColumn('derivative_attempts', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('span_start', 'timestamptz')
    .addColumn('span_end', 'timestamptz')
    .execute();

  await sql`alter table scan drop constraint scan_sha256_key`.execute(db);
  await sql`alter table scan add constraint scan_sha256_page_key unique (sha256, page_index)`.execute(db);

  // array_to_string is only STABLE; tags are text, whose output never changes, so this wrapper may be IMMUTABLE.
  await sql`
    create function scan_tags_text(tags text[]) returns text language sql immutable parallel safe
    as $$ select array_to_string(tags, ' ') $$`.execute(db);
  // 'simple': names, codes and archival references must match as typed, not stemmed.
  await sql`
    alter table scan add column search tsvector generated always as (
      to_tsvector('simple'::regconfig,
        original_name || ' ' || regexp_replace(original_name, '[^[:alnum:]]+', ' ', 'g') || ' ' ||
        notes || ' ' || condition_notes || ' ' || transcription || ' ' || observer || ' ' ||
        collection || ' ' || box || ' ' || folder || ' ' || item || ' ' || scan_tags_text(tags))
    ) stored`.execute(db);

  await sql`
    create function scan_set_span() returns trigger language plpgsql as $$
    declare
      drum_hours double precision;
    begin
      select chart_form.drum_hours into drum_hours from chart_form where chart_form.id = new.chart_form_id;
      new.span_start := coalesce(new.period_start, new.chart_on);
      new.span_end := coalesce(new.chart_off, new.span_start + make_interval(secs => coalesce(drum_hours, 0) * 3600));
      return new;
    end $$`.execute(db);
  await sql`
    create trigger scan_span before insert or update of period_start, chart_on, chart_off, chart_form_id on scan
    for each row execute function scan_set_span()`.execute(db);
  await sql`update scan set period_start = period_start`.execute(db);
  // Scans kept before derivatives existed: the worker's start-up sweep makes them.
  await sql`update scan set derivative_state = 'queued'`.execute(db);

  await sql`create index scan_tags_idx on scan using gin (tags)`.execute(db);
  await sql`create index scan_search_idx on scan using gin (search)`.execute(db);
  await sql`create index scan_span_idx on scan using gist (tstzrange(span_start, span_end, '[]')) where span_start is not null`.execute(db);
  await db.schema.createIndex('scan_batch_idx').on('scan').column('batch_id').where(sql.ref('batch_id'), 'is not', null).execute();
  await db.schema.createIndex('scan_instrument_period_idx').on('scan').columns(['instrument_id', 'period_start']).execute();
  await db.schema.createIndex('scan_chart_form_period_idx').on('scan').columns(['chart_form_id', 'period_start']).execute();
  await db.schema.createIndex('scan_box_idx').on('scan').columns(['collection', 'box']).execute();
  await db.schema.createIndex('scan_derivative_state_idx').on('scan').column('derivative_state').where('derivative_state', '<>', 'ready').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop trigger scan_span on scan`.execute(db);
  await sql`drop function scan_set_span()`.execute(db);
  await sql`alter table scan drop column search`.execute(db);
  await sql`drop function scan_tags_text(text[])`.execute(db);
  await sql`alter table scan drop constraint scan_sha256_page_key`.execute(db);
  await sql`delete from scan where page_index > 0`.execute(db);
  await sql`alter table scan add constraint scan_sha256_key unique (sha256)`.execute(db);
  for (const index of ['scan_tags_idx', 'scan_span_idx', 'scan_batch_idx', 'scan_instrument_period_idx', 'scan_chart_form_period_idx', 'scan_box_idx', 'scan_derivative_state_idx']) {
    await db.schema.dropIndex(index).ifExists().execute();
  }
  await db.schema
    .alterTable('scan')
    .dropColumn('page_index').dropColumn('page_count').dropColumn('batch_id').dropColumn('instrument_id')
    .dropColumn('chart_on').dropColumn('chart_off').dropColumn('observer').dropColumn('collection').dropColumn('box')
    .dropColumn('folder').dropColumn('item').dropColumn('condition_notes').dropColumn('notes').dropColumn('tags')
    .dropColumn('transcription').dropColumn('withdrawn_reason').dropColumn('dpi').dropColumn('orientation')
    .dropColumn('version').dropColumn('derivative_state').dropColumn('derivative_error').dropColumn('derivative_attempts')
    .dropColumn('span_start').dropColumn('span_end')
    .execute();
}

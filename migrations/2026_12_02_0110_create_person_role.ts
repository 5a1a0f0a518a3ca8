import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('person_role')
    .addColumn('person_id', 'uuid', (c) => c.notNull().references('person.id').onDelete('cascade'))
    // The role list is written out because a migration must not import the app's ROLES.
    .addColumn('role', 'text', (c) => c.notNull().check(sql`role in ('admin', 'archivist', 'volunteer', 'climatologist', 'teacher')`))
    .addPrimaryKeyConstraint('person_role_pk', ['person_id', 'role'])
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('person_role').execute();
}

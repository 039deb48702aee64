/**
 * The work record of a plan: each set and add-on as found (its leads as wired, before any lead change), so the
 * installation can be put back, and the bench's tick-offs and notes per step or part.
 */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('plan_work_records', (t) => {
    t.string('plan_id').primary().references('id').inTable('plans').onDelete('CASCADE');
    /** JSON: the parts as found (shared/schemas/work-record.schema.ts, AsFoundPart[]). */
    t.text('as_found').notNullable();
    t.string('recorded_by').nullable().references('id').inTable('users').onDelete('SET NULL');
    t.string('recorded_at').notNullable();
  });
  await knex.schema.createTable('plan_work_entries', (t) => {
    t.string('plan_id').notNullable().references('id').inTable('plans').onDelete('CASCADE');
    /** A step (`step:<part>:<n>`, `xc:<port>:<pair>`) or a part (`part:<id>`) of the work sheet. */
    t.string('entry_key', 100).notNullable();
    /** Stamped by the server when the step is ticked off; null while it is not done. */
    t.string('done_at').nullable();
    t.string('initials', 8).notNullable().defaultTo('');
    t.string('note', 1000).notNullable().defaultTo('');
    t.string('updated_by').nullable().references('id').inTable('users').onDelete('SET NULL');
    t.string('updated_at').notNullable();
    t.primary(['plan_id', 'entry_key']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('plan_work_entries');
  await knex.schema.dropTableIfExists('plan_work_records');
}

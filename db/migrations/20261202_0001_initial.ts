/** Accounts, their sign-in sessions and their saved plans. */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (t) => {
    t.string('id').primary();
    // Stored lower-cased by the API, so a plain unique index is enough.
    t.string('email', 254).notNullable().unique();
    t.string('display_name', 60).notNullable();
    t.string('role', 20).notNullable().checkIn(['restorer', 'instructor', 'trainee', 'admin']);
    t.string('password_hash').notNullable();
    t.string('created_at').notNullable();
  });
  await knex.schema.createTable('sessions', (t) => {
    t.string('id').primary();
    t.string('user_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    /** Milliseconds since the epoch. */
    t.bigInteger('expires_at').notNullable();
    t.index(['user_id']);
  });
  await knex.schema.createTable('plans', (t) => {
    t.string('id').primary();
    t.string('owner_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.string('name', 60).notNullable();
    t.text('description').notNullable().defaultTo('');
    /** The plan document as JSON text, validated by the engine's schema before it is written. */
    t.text('document').notNullable();
    t.integer('set_count').notNullable().defaultTo(0);
    t.string('created_at').notNullable();
    t.string('updated_at').notNullable();
    t.index(['owner_id', 'updated_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('plans');
  await knex.schema.dropTableIfExists('sessions');
  await knex.schema.dropTableIfExists('users');
}

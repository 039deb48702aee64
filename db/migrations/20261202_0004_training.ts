/** Training: classes, invitations, fault puzzles, demonstrations, assignments and trainees' runs. */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('training_classes', (t) => {
    t.string('id').primary();
    t.string('owner_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.string('name', 80).notNullable();
    t.string('created_at').notNullable();
    t.index(['owner_id']);
  });
  await knex.schema.createTable('training_members', (t) => {
    t.string('class_id').notNullable().references('id').inTable('training_classes').onDelete('CASCADE');
    t.string('user_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.string('joined_at').notNullable();
    t.primary(['class_id', 'user_id']);
    t.index(['user_id']);
  });
  await knex.schema.createTable('training_invitations', (t) => {
    t.string('id').primary();
    t.string('class_id').notNullable().references('id').inTable('training_classes').onDelete('CASCADE');
    t.string('email', 254).notNullable();
    /** SHA-256 of the single-use token sent in the link; the token itself is never stored. */
    t.string('token_hash', 64).notNullable().unique();
    t.string('expires_at').notNullable();
    t.string('sent_at').notNullable();
    t.string('accepted_at');
    t.string('accepted_by').references('id').inTable('users').onDelete('SET NULL');
    t.string('revoked_at');
    t.index(['class_id']);
  });
  await knex.schema.createTable('training_puzzles', (t) => {
    t.string('id').primary();
    t.string('owner_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.string('title', 80).notNullable();
    t.integer('level').notNullable();
    /** The whole puzzle (healthy plan, planted faults, repair, rubric) as JSON; never sent to trainees. */
    t.text('spec').notNullable();
    t.string('library_slug', 60);
    t.string('created_at').notNullable();
    t.index(['owner_id']);
  });
  await knex.schema.createTable('training_demonstrations', (t) => {
    t.string('id').primary();
    t.string('owner_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.string('title', 80).notNullable();
    t.text('spec').notNullable();
    t.string('created_at').notNullable();
    t.string('updated_at').notNullable();
    t.index(['owner_id']);
  });
  await knex.schema.createTable('training_assignments', (t) => {
    t.string('id').primary();
    t.string('class_id').notNullable().references('id').inTable('training_classes').onDelete('CASCADE');
    t.string('kind', 20).notNullable().checkIn(['puzzle', 'demonstration']);
    t.string('puzzle_id').references('id').inTable('training_puzzles').onDelete('CASCADE');
    t.string('demonstration_id').references('id').inTable('training_demonstrations').onDelete('CASCADE');
    t.string('due_at');
    t.string('created_at').notNullable();
    t.index(['class_id']);
  });
  await knex.schema.createTable('training_runs', (t) => {
    t.string('id').primary();
    t.string('assignment_id').notNullable().references('id').inTable('training_assignments').onDelete('CASCADE');
    t.string('user_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.text('state').notNullable();
    t.text('log').notNullable().defaultTo('[]');
    /** Distinct operating states reached, as keys. */
    t.text('seen').notNullable().defaultTo('[]');
    t.integer('attempts').notNullable().defaultTo(0);
    t.string('status', 20).notNullable().defaultTo('working');
    t.integer('best_score');
    t.text('last_result');
    t.integer('elapsed_ms');
    t.string('started_at').notNullable();
    t.string('finished_at');
    t.unique(['assignment_id', 'user_id']);
    t.index(['user_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of [
    'training_runs',
    'training_assignments',
    'training_demonstrations',
    'training_puzzles',
    'training_invitations',
    'training_members',
    'training_classes',
  ])
    await knex.schema.dropTableIfExists(table);
}

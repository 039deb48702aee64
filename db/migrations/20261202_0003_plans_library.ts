/**
 * The plans library: soft delete and list facts on plans, every saved version (revisions), read-only shares
 * (by e-mail or by link) and photos of a part's wiring.
 */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('plans', (t) => {
    /** Set when the owner deletes the plan; the plan is purged 30 days later. */
    t.string('deleted_at').nullable();
    /** Faults the bounded sweep found at the last save, for sorting the list. */
    t.integer('fault_count').notNullable().defaultTo(0);
    /** Size of the stored document in bytes, for the owner's storage quota. */
    t.integer('byte_size').notNullable().defaultTo(0);
    t.index(['owner_id', 'deleted_at']);
  });
  await knex.schema.createTable('plan_revisions', (t) => {
    t.increments('id');
    t.string('plan_id').notNullable().references('id').inTable('plans').onDelete('CASCADE');
    /** 1, 2, 3… per plan. */
    t.integer('number').notNullable();
    t.text('document').notNullable();
    t.string('author_id').nullable().references('id').inTable('users').onDelete('SET NULL');
    /** What made this revision: a save, a restore of an older one, an import. */
    t.string('reason', 20).notNullable().defaultTo('save');
    t.integer('restored_from').nullable();
    t.string('created_at').notNullable();
    t.unique(['plan_id', 'number']);
  });
  await knex.schema.createTable('plan_shares', (t) => {
    t.string('id').primary();
    t.string('plan_id').notNullable().references('id').inTable('plans').onDelete('CASCADE');
    t.string('kind', 10).notNullable().checkIn(['user', 'link']);
    /** Lower-cased address of the person who may view (kind user). */
    t.string('email', 254).nullable();
    /** SHA-256 of the link's secret (kind link); the secret itself is only ever shown to the owner once. */
    t.string('token_hash', 64).nullable().unique();
    /** A viewer who came in through a link: revoking the link revokes this row too. */
    t.string('via_share_id').nullable();
    t.string('created_at').notNullable();
    t.string('revoked_at').nullable();
    t.index(['plan_id']);
    t.index(['email']);
  });
  await knex.schema.createTable('plan_photos', (t) => {
    t.string('id').primary();
    t.string('plan_id').notNullable().references('id').inTable('plans').onDelete('CASCADE');
    /** Id of the part in the plan document (KSU, set, add-on or adapter). */
    t.string('part_id', 40).notNullable();
    t.string('caption', 200).notNullable().defaultTo('');
    /** Random file names under the photo folder. */
    t.string('file_name', 80).notNullable();
    t.string('thumb_name', 80).notNullable();
    t.string('mime', 20).notNullable();
    t.integer('width').notNullable();
    t.integer('height').notNullable();
    t.integer('byte_size').notNullable();
    t.string('uploaded_by').nullable().references('id').inTable('users').onDelete('SET NULL');
    t.string('created_at').notNullable();
    t.index(['plan_id', 'part_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('plan_photos');
  await knex.schema.dropTableIfExists('plan_shares');
  await knex.schema.dropTableIfExists('plan_revisions');
  await knex.schema.alterTable('plans', (t) => {
    t.dropIndex(['owner_id', 'deleted_at']);
    t.dropColumn('deleted_at');
    t.dropColumn('fault_count');
    t.dropColumn('byte_size');
  });
}

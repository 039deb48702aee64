/**
 * Account lifecycle: verification, disabling, second factor and last sign-in on users; sessions stored
 * by the hash of their id with absolute and idle limits; single-use tokens for mail links; failed
 * sign-in counters that survive a restart; the admin audit log.
 */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    t.string('email_verified_at');
    t.string('disabled_at');
    t.string('last_sign_in_at');
    t.boolean('must_change_password').notNullable().defaultTo(false);
    /** Base32 TOTP secret; set on enrolment, active once `totp_enabled_at` is set. */
    t.string('totp_secret');
    t.string('totp_enabled_at');
  });
  // Accounts that existed before verification was introduced count as verified.
  await knex('users').update({ email_verified_at: knex.ref('created_at') });

  // Old rows hold raw session ids; they cannot be turned into hashes, so everyone signs in again.
  await knex.schema.dropTable('sessions');
  await knex.schema.createTable('sessions', (t) => {
    /** SHA-256 (hex) of the session id in the cookie; the id itself is never stored. */
    t.string('id', 64).primary();
    t.string('user_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    /** Milliseconds since the epoch. */
    t.bigInteger('created_at').notNullable();
    t.bigInteger('last_used_at').notNullable();
    /** The absolute end, fixed at creation. */
    t.bigInteger('expires_at').notNullable();
    t.string('user_agent', 200).notNullable().defaultTo('');
    /** Password checked, TOTP code still owed. */
    t.boolean('pending_second_factor').notNullable().defaultTo(false);
    t.index(['user_id']);
  });

  await knex.schema.createTable('account_tokens', (t) => {
    /** SHA-256 (hex) of the token sent by mail. */
    t.string('id', 64).primary();
    t.string('user_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.string('purpose', 20).notNullable().checkIn(['verify-email', 'reset-password', 'change-email']);
    /** The new address, for change-email. */
    t.string('email', 254);
    t.bigInteger('expires_at').notNullable();
    t.index(['user_id', 'purpose']);
  });

  await knex.schema.createTable('sign_in_failures', (t) => {
    /** "account:<e-mail>" or "address:<client address>". */
    t.string('key', 300).primary();
    t.integer('failures').notNullable();
    t.bigInteger('window_started_at').notNullable();
  });

  await knex.schema.createTable('audit_log', (t) => {
    t.increments('id');
    t.string('at').notNullable();
    // No foreign keys: the record outlives the accounts it names.
    t.string('actor_id');
    t.string('actor_email', 254).notNullable();
    t.string('action', 40).notNullable();
    t.string('target_id');
    t.string('target_email', 254);
    t.string('detail', 500).notNullable().defaultTo('');
    t.index(['at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('audit_log');
  await knex.schema.dropTableIfExists('sign_in_failures');
  await knex.schema.dropTableIfExists('account_tokens');
  await knex.schema.dropTable('sessions');
  await knex.schema.createTable('sessions', (t) => {
    t.string('id').primary();
    t.string('user_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.bigInteger('expires_at').notNullable();
    t.index(['user_id']);
  });
  await knex.schema.alterTable('users', (t) => {
    for (const c of [
      'email_verified_at',
      'disabled_at',
      'last_sign_in_at',
      'must_change_password',
      'totp_secret',
      'totp_enabled_at',
    ])
      t.dropColumn(c);
  });
}

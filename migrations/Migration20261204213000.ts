import { Migration } from '@mikro-orm/migrations';

/**
 * Sign-in throttling and sensor rate limits share one table in the layout of rate-limiter-flexible's
 * PostgreSQL store (key, points, expire in epoch ms); the two hand-made tables go.
 */
export class Migration20261204213000 extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create table "rate_limits" ("key" text not null, "points" int not null default 0, "expire" bigint null, constraint "rate_limits_pkey" primary key ("key"));`);
    this.addSql(`create index "rate_limits_expire_index" on "rate_limits" ("expire");`);
    this.addSql(`drop table if exists "login_attempts" cascade;`);
    this.addSql(`drop table if exists "rate_counters" cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql(`create table "login_attempts" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "key" varchar(400) not null, constraint "login_attempts_pkey" primary key ("id"));`);
    this.addSql(`create index "login_attempts_key_created_at_index" on "login_attempts" ("key", "created_at");`);
    this.addSql(`create table "rate_counters" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "key" varchar(200) not null, "window_start" timestamptz not null, "count" int not null default 0, constraint "rate_counters_pkey" primary key ("id"));`);
    this.addSql(`alter table "rate_counters" add constraint "rate_counters_key_window_start_unique" unique ("key", "window_start");`);
    this.addSql(`drop table if exists "rate_limits" cascade;`);
  }
}

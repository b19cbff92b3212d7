import { Migration } from '@mikro-orm/migrations';

/** Cooks' day: check-ins, readings, idempotency keys, push subscriptions, cooker API keys, rate counters, settings, alert jobs. */
export class Migration20261202010920 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "idempotency_records" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "kitchen_id" uuid not null, "key" varchar(64) not null, "scope" varchar(32) not null, "request_hash" varchar(64) not null, "status" int not null, "response" jsonb not null, constraint "idempotency_records_pkey" primary key ("id"));`);
    this.addSql(`alter table "idempotency_records" add constraint "idempotency_records_kitchen_id_key_unique" unique ("kitchen_id", "key");`);

    this.addSql(`create table "alert_jobs" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "kitchen_id" uuid not null, "date" varchar(10) not null, "plan_id" uuid not null, "kind" varchar(16) not null, "dedupe_key" varchar(200) not null, "batch_id" varchar(64) null, "cooker_id" uuid null, "fire_at" timestamptz not null, "job_id" uuid null, "state" varchar(16) not null, "params" jsonb not null, constraint "alert_jobs_pkey" primary key ("id"));`);
    this.addSql(`alter table "alert_jobs" add constraint "alert_jobs_dedupe_key_unique" unique ("dedupe_key");`);
    this.addSql(`create index "alert_jobs_kitchen_id_date_index" on "alert_jobs" ("kitchen_id", "date");`);

    this.addSql(`create table "rate_counters" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "key" varchar(200) not null, "window_start" timestamptz not null, "count" int not null default 0, constraint "rate_counters_pkey" primary key ("id"));`);
    this.addSql(`alter table "rate_counters" add constraint "rate_counters_key_window_start_unique" unique ("key", "window_start");`);

    this.addSql(`create table "settings" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "key" varchar(64) not null, "value" jsonb not null, constraint "settings_pkey" primary key ("id"));`);
    this.addSql(`alter table "settings" add constraint "settings_key_unique" unique ("key");`);

    this.addSql(`create table "readings" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "kitchen_id" uuid not null, "cooker_id" uuid not null, "at" timestamptz not null, "store_c" double precision null, "pot_c" double precision null, "pot_id" varchar(40) null, "source" varchar(8) not null, "user_id" uuid null, "api_key_id" uuid null, constraint "readings_pkey" primary key ("id"));`);
    this.addSql(`create index "readings_cooker_id_at_index" on "readings" ("cooker_id", "at");`);

    this.addSql(`create table "push_subscriptions" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "user_id" uuid not null, "kitchen_id" uuid not null, "endpoint" text not null, "p256dh" varchar(200) not null, "auth" varchar(64) not null, "last_success_at" timestamptz null, "failures" int not null default 0, constraint "push_subscriptions_pkey" primary key ("id"));`);
    this.addSql(`alter table "push_subscriptions" add constraint "push_subscriptions_endpoint_unique" unique ("endpoint");`);
    this.addSql(`create index "push_subscriptions_kitchen_id_index" on "push_subscriptions" ("kitchen_id");`);

    this.addSql(`create table "cooker_api_keys" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "kitchen_id" uuid not null, "cooker_id" uuid not null, "label" varchar(100) not null, "key_hash" varchar(64) not null, "prefix" varchar(16) not null, "created_by_id" uuid null, "revoked_at" timestamptz null, "last_used_at" timestamptz null, constraint "cooker_api_keys_pkey" primary key ("id"));`);
    this.addSql(`alter table "cooker_api_keys" add constraint "cooker_api_keys_key_hash_unique" unique ("key_hash");`);

    this.addSql(`create table "check_ins" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "kitchen_id" uuid not null, "plan_id" uuid not null, "date" varchar(10) not null, "batch_id" varchar(64) not null, "cooker_id" uuid null, "kind" varchar(16) not null, "at" timestamptz not null, "user_id" uuid null, constraint "check_ins_pkey" primary key ("id"));`);
    this.addSql(`create index "check_ins_kitchen_id_date_index" on "check_ins" ("kitchen_id", "date");`);

    this.addSql(`alter table "alert_jobs" add constraint "alert_jobs_kitchen_id_foreign" foreign key ("kitchen_id") references "kitchens" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "readings" add constraint "readings_kitchen_id_foreign" foreign key ("kitchen_id") references "kitchens" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "readings" add constraint "readings_cooker_id_foreign" foreign key ("cooker_id") references "cookers" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "readings" add constraint "readings_user_id_foreign" foreign key ("user_id") references "users" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "push_subscriptions" add constraint "push_subscriptions_user_id_foreign" foreign key ("user_id") references "users" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "push_subscriptions" add constraint "push_subscriptions_kitchen_id_foreign" foreign key ("kitchen_id") references "kitchens" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "cooker_api_keys" add constraint "cooker_api_keys_kitchen_id_foreign" foreign key ("kitchen_id") references "kitchens" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "cooker_api_keys" add constraint "cooker_api_keys_cooker_id_foreign" foreign key ("cooker_id") references "cookers" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "cooker_api_keys" add constraint "cooker_api_keys_created_by_id_foreign" foreign key ("created_by_id") references "users" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "check_ins" add constraint "check_ins_kitchen_id_foreign" foreign key ("kitchen_id") references "kitchens" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "check_ins" add constraint "check_ins_user_id_foreign" foreign key ("user_id") references "users" ("id") on update cascade on delete set null;`);

  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "idempotency_records" cascade;`);

    this.addSql(`drop table if exists "alert_jobs" cascade;`);

    this.addSql(`drop table if exists "rate_counters" cascade;`);

    this.addSql(`drop table if exists "settings" cascade;`);

    this.addSql(`drop table if exists "readings" cascade;`);

    this.addSql(`drop table if exists "push_subscriptions" cascade;`);

    this.addSql(`drop table if exists "cooker_api_keys" cascade;`);

    this.addSql(`drop table if exists "check_ins" cascade;`);
  }

}

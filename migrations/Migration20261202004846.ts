import { Migration } from '@mikro-orm/migrations';

export class Migration20261202004846 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "forecasts" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "kitchen_id" uuid not null, "source" varchar(16) not null, "issued_at" timestamptz null, "fetched_at" timestamptz not null, "status" varchar(8) not null, "error" varchar(1000) null, "covers_from" timestamptz null, "covers_to" timestamptz null, "upload_name" varchar(255) null, "upload_mode" varchar(16) null, constraint "forecasts_pkey" primary key ("id"));`);
    this.addSql(`create index "forecasts_kitchen_id_fetched_at_index" on "forecasts" ("kitchen_id", "fetched_at");`);
    this.addSql(`alter table "forecasts" add constraint "forecasts_kitchen_id_source_issued_at_unique" unique ("kitchen_id", "source", "issued_at");`);

    this.addSql(`create table "forecast_points" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "forecast_id" uuid not null, "t" timestamptz not null, "ghi" double precision not null, "dni" double precision null, "dhi" double precision null, "t_air_c" double precision null, "wind_ms" double precision null, "cloud_okta" double precision null, constraint "forecast_points_pkey" primary key ("id"));`);
    this.addSql(`alter table "forecast_points" add constraint "forecast_points_forecast_id_t_unique" unique ("forecast_id", "t");`);

    this.addSql(`alter table "forecasts" add constraint "forecasts_kitchen_id_foreign" foreign key ("kitchen_id") references "kitchens" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "forecast_points" add constraint "forecast_points_forecast_id_foreign" foreign key ("forecast_id") references "forecasts" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "kitchens" add column "clearness" jsonb null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "forecast_points" drop constraint "forecast_points_forecast_id_foreign";`);

    this.addSql(`drop table if exists "forecasts" cascade;`);

    this.addSql(`drop table if exists "forecast_points" cascade;`);

    this.addSql(`alter table "kitchens" drop column "clearness";`);
  }

}

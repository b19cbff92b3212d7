import { Migration } from '@mikro-orm/migrations';

export class Migration20261202003926 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "storage_media" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "organisation_id" uuid not null, "name" varchar(200) not null, "rows" jsonb not null, "smoke_point_c" double precision null, "source" varchar(500) null, constraint "storage_media_pkey" primary key ("id"));`);

    this.addSql(`create table "cookers" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "kitchen_id" uuid not null, "name" varchar(200) not null, "kind" varchar(24) not null, "aperture_m2" double precision not null, "tracking" varchar(16) not null, "tilt_deg" double precision not null, "surface_azimuth_deg" double precision not null, "collector_model" varchar(16) not null, "eta0" double precision not null, "a1" double precision not null default 0, "a2" double precision not null default 0, "u_loss_wper_k" double precision not null default 0, "medium_id" varchar(64) not null, "custom_medium_id" uuid null, "store_mass_kg" double precision not null, "store_ua_wper_k" double precision not null, "store_nodes" int not null default 1, "max_safe_temp_c" double precision not null, "min_useful_temp_c" double precision not null, "pots" jsonb not null, "archived" boolean not null default false, constraint "cookers_pkey" primary key ("id"));`);

    this.addSql(`alter table "storage_media" add constraint "storage_media_organisation_id_foreign" foreign key ("organisation_id") references "organisations" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "cookers" add constraint "cookers_kitchen_id_foreign" foreign key ("kitchen_id") references "kitchens" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "cookers" add constraint "cookers_custom_medium_id_foreign" foreign key ("custom_medium_id") references "storage_media" ("id") on update cascade on delete set null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "cookers" drop constraint "cookers_custom_medium_id_foreign";`);

    this.addSql(`drop table if exists "storage_media" cascade;`);

    this.addSql(`drop table if exists "cookers" cascade;`);
  }

}

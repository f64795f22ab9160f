import { Migration } from '@mikro-orm/migrations';

export class Migration20261202054054 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "spectrum" ("id" uuid not null, "group_id" uuid not null, "submitter_id" uuid null, "title" varchar(200) not null, "material" varchar(200) not null, "formula" varchar(100) null, "method" varchar(200) null, "code" varchar(200) null, "supercell" varchar(100) null, "qmesh" varchar(100) null, "notes" text null, "status" text check ("status" in ('screening', 'in-review', 'returned', 'approved', 'rejected', 'withdrawn')) not null default 'screening', "reviewer_ids" jsonb not null default '[]', "current_revision_id" uuid null, "verdict" text check ("verdict" in ('pass', 'warn', 'fail')) null, "revision_count" int not null default 0, "version" int not null default 1, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "spectrum_pkey" primary key ("id"));`);
    this.addSql(`create index "spectrum_group_id_status_index" on "spectrum" ("group_id", "status");`);
    this.addSql(`create index "spectrum_group_id_updated_at_index" on "spectrum" ("group_id", "updated_at");`);

    this.addSql(`create table "revision" ("id" uuid not null, "spectrum_id" uuid not null, "number" int not null, "file_key" varchar(300) not null, "ufs_url" text not null, "original_name" varchar(255) not null, "size" bigint not null, "format" varchar(16) not null, "note" text null, "uploader_id" uuid null, "screening_status" text check ("screening_status" in ('pending', 'done', 'error')) not null default 'pending', "screening_error" jsonb null, "verdict" text check ("verdict" in ('pass', 'warn', 'fail')) null, "summary" jsonb null, "fail_count" int not null default 0, "warn_count" int not null default 0, "info_count" int not null default 0, "created_at" timestamptz not null, "screened_at" timestamptz null, constraint "revision_pkey" primary key ("id"));`);
    this.addSql(`alter table "revision" add constraint "revision_file_key_unique" unique ("file_key");`);
    this.addSql(`create index "revision_screening_status_created_at_index" on "revision" ("screening_status", "created_at");`);
    this.addSql(`alter table "revision" add constraint "revision_spectrum_id_number_unique" unique ("spectrum_id", "number");`);

    this.addSql(`create table "stored_dispersion" ("revision_id" uuid not null, "meta" jsonb not null, "frequencies" bytea not null, "q" bytea null, "distances" bytea null, "weights" bytea null, "byte_size" bigint not null, constraint "stored_dispersion_pkey" primary key ("revision_id"));`);

    // Float64 arrays do not compress: store them out of line without trying (faster writes).
    this.addSql(`alter table "stored_dispersion" alter column "frequencies" set storage external, alter column "q" set storage external, alter column "distances" set storage external, alter column "weights" set storage external;`);

    this.addSql(`create table "finding" ("id" uuid not null, "revision_id" uuid not null, "ordinal" int not null, "check" varchar(32) not null, "severity" text check ("severity" in ('info', 'warn', 'fail')) not null, "segment" int null, "index" int null, "branch" int null, "q" jsonb null, "value" double precision null, "limit" double precision null, "message" text not null, constraint "finding_pkey" primary key ("id"));`);
    this.addSql(`create index "finding_revision_id_ordinal_index" on "finding" ("revision_id", "ordinal");`);

    this.addSql(`alter table "spectrum" add constraint "spectrum_group_id_foreign" foreign key ("group_id") references "lab_group" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "spectrum" add constraint "spectrum_submitter_id_foreign" foreign key ("submitter_id") references "app_user" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "revision" add constraint "revision_spectrum_id_foreign" foreign key ("spectrum_id") references "spectrum" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "revision" add constraint "revision_uploader_id_foreign" foreign key ("uploader_id") references "app_user" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "stored_dispersion" add constraint "stored_dispersion_revision_id_foreign" foreign key ("revision_id") references "revision" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "finding" add constraint "finding_revision_id_foreign" foreign key ("revision_id") references "revision" ("id") on update cascade on delete cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "revision" drop constraint "revision_spectrum_id_foreign";`);

    this.addSql(`alter table "stored_dispersion" drop constraint "stored_dispersion_revision_id_foreign";`);

    this.addSql(`alter table "finding" drop constraint "finding_revision_id_foreign";`);

    this.addSql(`drop table if exists "spectrum" cascade;`);

    this.addSql(`drop table if exists "revision" cascade;`);

    this.addSql(`drop table if exists "stored_dispersion" cascade;`);

    this.addSql(`drop table if exists "finding" cascade;`);
  }

}

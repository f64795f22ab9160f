import { Migration } from '@mikro-orm/migrations';

export class Migration20261202052753 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "lab_group" ("id" uuid not null, "slug" varchar(64) not null, "name" varchar(200) not null, "created_at" timestamptz not null, constraint "lab_group_pkey" primary key ("id"));`);
    this.addSql(`alter table "lab_group" add constraint "lab_group_slug_unique" unique ("slug");`);

    this.addSql(`create table "app_user" ("id" uuid not null, "email" varchar(320) not null, "name" varchar(200) null, "email_verified" timestamptz null, "password_hash" text null, "created_at" timestamptz not null, constraint "app_user_pkey" primary key ("id"));`);
    this.addSql(`alter table "app_user" add constraint "app_user_email_unique" unique ("email");`);

    this.addSql(`create table "membership" ("id" uuid not null, "user_id" uuid not null, "group_id" uuid not null, "role" text check ("role" in ('admin', 'reviewer', 'submitter', 'observer')) not null, "joined_at" timestamptz not null, constraint "membership_pkey" primary key ("id"));`);
    this.addSql(`alter table "membership" add constraint "membership_user_id_group_id_unique" unique ("user_id", "group_id");`);

    this.addSql(`create table "invitation" ("id" uuid not null, "group_id" uuid not null, "email" varchar(320) not null, "role" text check ("role" in ('admin', 'reviewer', 'submitter', 'observer')) not null, "token_hash" varchar(64) not null, "invited_by_id" uuid null, "created_at" timestamptz not null, "expires_at" timestamptz not null, "accepted_at" timestamptz null, "revoked_at" timestamptz null, constraint "invitation_pkey" primary key ("id"));`);
    this.addSql(`alter table "invitation" add constraint "invitation_token_hash_unique" unique ("token_hash");`);
    this.addSql(`create index "invitation_group_id_email_index" on "invitation" ("group_id", "email");`);

    this.addSql(`create table "audit_event" ("id" uuid not null, "group_id" uuid null, "actor_id" uuid null, "action" varchar(64) not null, "target" varchar(200) null, "data" jsonb not null default '{}', "created_at" timestamptz not null, constraint "audit_event_pkey" primary key ("id"));`);
    this.addSql(`create index "audit_event_group_id_created_at_index" on "audit_event" ("group_id", "created_at");`);
    this.addSql(`create index "audit_event_action_index" on "audit_event" ("action");`);

    this.addSql(`create table "api_token" ("id" uuid not null, "user_id" uuid not null, "group_id" uuid not null, "name" varchar(100) not null, "hash" varchar(64) not null, "prefix" varchar(16) not null, "created_at" timestamptz not null, "last_used_at" timestamptz null, "revoked_at" timestamptz null, constraint "api_token_pkey" primary key ("id"));`);
    this.addSql(`alter table "api_token" add constraint "api_token_hash_unique" unique ("hash");`);

    this.addSql(`create table "verification_token" ("token" varchar(128) not null, "identifier" varchar(320) not null, "expires" timestamptz not null, constraint "verification_token_pkey" primary key ("token"));`);
    this.addSql(`create index "verification_token_identifier_index" on "verification_token" ("identifier");`);
    this.addSql(`create index "verification_token_expires_index" on "verification_token" ("expires");`);

    this.addSql(`alter table "membership" add constraint "membership_user_id_foreign" foreign key ("user_id") references "app_user" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "membership" add constraint "membership_group_id_foreign" foreign key ("group_id") references "lab_group" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "invitation" add constraint "invitation_group_id_foreign" foreign key ("group_id") references "lab_group" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "invitation" add constraint "invitation_invited_by_id_foreign" foreign key ("invited_by_id") references "app_user" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "audit_event" add constraint "audit_event_group_id_foreign" foreign key ("group_id") references "lab_group" ("id") on update cascade on delete set null;`);
    this.addSql(`alter table "audit_event" add constraint "audit_event_actor_id_foreign" foreign key ("actor_id") references "app_user" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "api_token" add constraint "api_token_user_id_foreign" foreign key ("user_id") references "app_user" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "api_token" add constraint "api_token_group_id_foreign" foreign key ("group_id") references "lab_group" ("id") on update cascade on delete cascade;`);
  }

}

import { Migration } from '@mikro-orm/migrations';

export class Migration20261202055648 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "outbox" ("id" uuid not null, "type" varchar(64) not null, "group_id" uuid null, "payload" jsonb not null, "created_at" timestamptz not null, "processed_at" timestamptz null, "attempts" int not null default 0, "last_error" text null, constraint "outbox_pkey" primary key ("id"));`);
    this.addSql(`create index "outbox_processed_at_created_at_index" on "outbox" ("processed_at", "created_at");`);

    this.addSql(`create table "thread" ("id" uuid not null, "spectrum_id" uuid not null, "revision_id" uuid not null, "author_id" uuid null, "anchor_kind" text check ("anchor_kind" in ('point', 'finding', 'spectrum')) not null, "anchor_index" int null, "anchor_branch" int null, "anchor_frequency" double precision null, "finding_id" uuid null, "body" text not null, "blocking" boolean not null default false, "resolved" boolean not null default false, "resolved_at" timestamptz null, "resolved_by_id" uuid null, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "thread_pkey" primary key ("id"));`);
    this.addSql(`create index "thread_spectrum_id_created_at_index" on "thread" ("spectrum_id", "created_at");`);

    this.addSql(`create table "thread_reply" ("id" uuid not null, "thread_id" uuid not null, "author_id" uuid null, "body" text not null, "created_at" timestamptz not null, constraint "thread_reply_pkey" primary key ("id"));`);
    this.addSql(`create index "thread_reply_thread_id_created_at_index" on "thread_reply" ("thread_id", "created_at");`);

    this.addSql(`create table "group_policy" ("group_id" uuid not null, "required_approvals" int not null default 1, "blocking_severities" jsonb not null, "checks" jsonb not null, "updated_by_id" uuid null, "updated_at" timestamptz not null, constraint "group_policy_pkey" primary key ("group_id"));`);

    this.addSql(`create table "decision" ("id" uuid not null, "spectrum_id" uuid not null, "revision_id" uuid not null, "reviewer_id" uuid null, "verdict" text check ("verdict" in ('approve', 'return', 'reject')) not null, "note" text not null, "superseded_at" timestamptz null, "created_at" timestamptz not null, constraint "decision_pkey" primary key ("id"));`);
    this.addSql(`create index "decision_spectrum_id_created_at_index" on "decision" ("spectrum_id", "created_at");`);
    this.addSql(`create index "decision_revision_id_verdict_index" on "decision" ("revision_id", "verdict");`);

    this.addSql(`create table "waiver" ("id" uuid not null, "finding_id" uuid not null, "author_id" uuid null, "reason" text not null, "created_at" timestamptz not null, constraint "waiver_pkey" primary key ("id"));`);
    this.addSql(`alter table "waiver" add constraint "waiver_finding_id_unique" unique ("finding_id");`);

    this.addSql(`alter table "outbox" add constraint "outbox_group_id_foreign" foreign key ("group_id") references "lab_group" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "thread" add constraint "thread_spectrum_id_foreign" foreign key ("spectrum_id") references "spectrum" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "thread" add constraint "thread_revision_id_foreign" foreign key ("revision_id") references "revision" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "thread" add constraint "thread_author_id_foreign" foreign key ("author_id") references "app_user" ("id") on update cascade on delete set null;`);
    this.addSql(`alter table "thread" add constraint "thread_finding_id_foreign" foreign key ("finding_id") references "finding" ("id") on update cascade on delete set null;`);
    this.addSql(`alter table "thread" add constraint "thread_resolved_by_id_foreign" foreign key ("resolved_by_id") references "app_user" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "thread_reply" add constraint "thread_reply_thread_id_foreign" foreign key ("thread_id") references "thread" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "thread_reply" add constraint "thread_reply_author_id_foreign" foreign key ("author_id") references "app_user" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "group_policy" add constraint "group_policy_group_id_foreign" foreign key ("group_id") references "lab_group" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "group_policy" add constraint "group_policy_updated_by_id_foreign" foreign key ("updated_by_id") references "app_user" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "decision" add constraint "decision_spectrum_id_foreign" foreign key ("spectrum_id") references "spectrum" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "decision" add constraint "decision_revision_id_foreign" foreign key ("revision_id") references "revision" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "decision" add constraint "decision_reviewer_id_foreign" foreign key ("reviewer_id") references "app_user" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "waiver" add constraint "waiver_finding_id_foreign" foreign key ("finding_id") references "finding" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "waiver" add constraint "waiver_author_id_foreign" foreign key ("author_id") references "app_user" ("id") on update cascade on delete set null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "thread_reply" drop constraint "thread_reply_thread_id_foreign";`);

    this.addSql(`drop table if exists "outbox" cascade;`);

    this.addSql(`drop table if exists "thread" cascade;`);

    this.addSql(`drop table if exists "thread_reply" cascade;`);

    this.addSql(`drop table if exists "group_policy" cascade;`);

    this.addSql(`drop table if exists "decision" cascade;`);

    this.addSql(`drop table if exists "waiver" cascade;`);
  }

}

import { Migration } from '@mikro-orm/migrations';

export class Migration20261202061120 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "notification_preference" ("id" uuid not null, "user_id" uuid not null, "kind" varchar(32) not null, "mode" text check ("mode" in ('immediate', 'digest', 'off')) not null, "updated_at" timestamptz not null, constraint "notification_preference_pkey" primary key ("id"));`);
    this.addSql(`alter table "notification_preference" add constraint "notification_preference_user_id_kind_unique" unique ("user_id", "kind");`);

    this.addSql(`create table "notification_delivery" ("id" uuid not null, "event_id" uuid not null, "user_id" uuid not null, "group_id" uuid not null, "spectrum_id" uuid not null, "spectrum_title" varchar(200) not null, "kind" varchar(32) not null, "mode" text check ("mode" in ('immediate', 'digest')) not null, "subject" text not null, "summary" text not null, "detail" text null, "link" text not null, "status" text check ("status" in ('pending', 'sent')) not null default 'pending', "attempts" int not null default 0, "last_error" text null, "last_attempt_at" timestamptz null, "sent_at" timestamptz null, "occurred_at" timestamptz not null, "created_at" timestamptz not null, constraint "notification_delivery_pkey" primary key ("id"));`);
    this.addSql(`create index "notification_delivery_status_mode_user_id_index" on "notification_delivery" ("status", "mode", "user_id");`);
    this.addSql(`alter table "notification_delivery" add constraint "notification_delivery_event_id_user_id_unique" unique ("event_id", "user_id");`);

    this.addSql(`alter table "notification_preference" add constraint "notification_preference_user_id_foreign" foreign key ("user_id") references "app_user" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "notification_delivery" add constraint "notification_delivery_user_id_foreign" foreign key ("user_id") references "app_user" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "notification_delivery" add constraint "notification_delivery_group_id_foreign" foreign key ("group_id") references "lab_group" ("id") on update cascade on delete cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "notification_preference" cascade;`);

    this.addSql(`drop table if exists "notification_delivery" cascade;`);
  }

}

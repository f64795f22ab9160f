import { Migration } from '@mikro-orm/migrations';

export class Migration20261202082642 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "sign_in_link_request" ("id" uuid not null, "key" varchar(400) not null, "at" timestamptz not null, constraint "sign_in_link_request_pkey" primary key ("id"));`);
    this.addSql(`create index "sign_in_link_request_key_at_index" on "sign_in_link_request" ("key", "at");`);
    this.addSql(`create index "sign_in_link_request_at_index" on "sign_in_link_request" ("at");`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "sign_in_link_request" cascade;`);
  }

}

CREATE TYPE "public"."mask_medium" AS ENUM('film', 'chrome');--> statement-breakpoint
CREATE TYPE "public"."mask_polarity" AS ENUM('positive', 'negative');--> statement-breakpoint
CREATE TYPE "public"."order_status" AS ENUM('received', 'in-fabrication', 'shipped', 'delivered', 'on-hold');--> statement-breakpoint
CREATE TYPE "public"."order_substrate" AS ENUM('glass', 'pdms-on-glass', 'pdms-on-pdms', 'thermoplastic');--> statement-breakpoint
CREATE TABLE "as_built_files" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"lab_id" uuid NOT NULL,
	"as_built_id" uuid NOT NULL,
	"object_key" varchar(300) NOT NULL,
	"content_type" varchar(60) NOT NULL,
	"bytes" integer NOT NULL,
	"file_name" varchar(200) DEFAULT '' NOT NULL,
	"created_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "as_builts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"lab_id" uuid NOT NULL,
	"revision_id" uuid NOT NULL,
	"depths" jsonb NOT NULL,
	"widths" jsonb NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"document" jsonb NOT NULL,
	"summary" jsonb NOT NULL,
	"recorded_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "fab_order_messages" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"order_id" uuid NOT NULL,
	"lab_id" uuid NOT NULL,
	"author_id" uuid NOT NULL,
	"body" text NOT NULL,
	"status" "order_status",
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "fab_orders" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"lab_id" uuid NOT NULL,
	"revision_id" uuid NOT NULL,
	"release_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"status" "order_status" DEFAULT 'received' NOT NULL,
	"status_at" timestamp with time zone DEFAULT now() NOT NULL,
	"hold_reason" text,
	"quantity" integer DEFAULT 1 NOT NULL,
	"substrate" "order_substrate" DEFAULT 'pdms-on-glass' NOT NULL,
	"mask_polarity" "mask_polarity" DEFAULT 'positive' NOT NULL,
	"mask_medium" "mask_medium" DEFAULT 'film' NOT NULL,
	"due_date" varchar(10),
	"po_number" varchar(60) DEFAULT '' NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"tracking_number" varchar(80),
	"created_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "fab_orders_revision_id_unique" UNIQUE("revision_id"),
	CONSTRAINT "fab_orders_release_id_unique" UNIQUE("release_id")
);
--> statement-breakpoint
ALTER TABLE "as_built_files" ADD CONSTRAINT "as_built_files_lab_id_labs_id_fk" FOREIGN KEY ("lab_id") REFERENCES "public"."labs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "as_built_files" ADD CONSTRAINT "as_built_files_as_built_id_as_builts_id_fk" FOREIGN KEY ("as_built_id") REFERENCES "public"."as_builts"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "as_built_files" ADD CONSTRAINT "as_built_files_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "as_builts" ADD CONSTRAINT "as_builts_lab_id_labs_id_fk" FOREIGN KEY ("lab_id") REFERENCES "public"."labs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "as_builts" ADD CONSTRAINT "as_builts_revision_id_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."revisions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "as_builts" ADD CONSTRAINT "as_builts_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fab_order_messages" ADD CONSTRAINT "fab_order_messages_order_id_fab_orders_id_fk" FOREIGN KEY ("order_id") REFERENCES "public"."fab_orders"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fab_order_messages" ADD CONSTRAINT "fab_order_messages_lab_id_labs_id_fk" FOREIGN KEY ("lab_id") REFERENCES "public"."labs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fab_order_messages" ADD CONSTRAINT "fab_order_messages_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fab_orders" ADD CONSTRAINT "fab_orders_lab_id_labs_id_fk" FOREIGN KEY ("lab_id") REFERENCES "public"."labs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fab_orders" ADD CONSTRAINT "fab_orders_revision_id_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."revisions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fab_orders" ADD CONSTRAINT "fab_orders_release_id_releases_id_fk" FOREIGN KEY ("release_id") REFERENCES "public"."releases"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fab_orders" ADD CONSTRAINT "fab_orders_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "as_built_files_as_built_idx" ON "as_built_files" USING btree ("as_built_id");--> statement-breakpoint
CREATE INDEX "as_builts_revision_idx" ON "as_builts" USING btree ("revision_id","created_at");--> statement-breakpoint
CREATE INDEX "fab_order_messages_order_idx" ON "fab_order_messages" USING btree ("order_id","created_at");--> statement-breakpoint
CREATE INDEX "fab_orders_lab_idx" ON "fab_orders" USING btree ("lab_id","status");--> statement-breakpoint
CREATE UNIQUE INDEX "fab_orders_lab_number_idx" ON "fab_orders" USING btree ("lab_id","number");
CREATE TABLE "bench_micrographs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"lab_id" uuid NOT NULL,
	"run_id" uuid NOT NULL,
	"object_key" varchar(300) NOT NULL,
	"thumbnail_key" varchar(300),
	"content_type" varchar(40) NOT NULL,
	"bytes" integer NOT NULL,
	"file_name" varchar(200) DEFAULT '' NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL,
	"um_per_px" double precision NOT NULL,
	"status" varchar(16) DEFAULT 'queued' NOT NULL,
	"progress" double precision DEFAULT 0 NOT NULL,
	"error" text,
	"measurement" jsonb,
	"excluded" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"created_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "bench_runs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"lab_id" uuid NOT NULL,
	"design_id" uuid NOT NULL,
	"revision_id" uuid NOT NULL,
	"operating_point_id" varchar(64),
	"junction_id" varchar(64),
	"conditions" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"as_built" jsonb,
	"quantity" varchar(16) DEFAULT 'diameter' NOT NULL,
	"source" varchar(16) NOT NULL,
	"values_um" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"count" integer DEFAULT 0 NOT NULL,
	"mean_um" double precision,
	"sd_um" double precision,
	"cv" double precision,
	"frequency_hz" double precision,
	"predicted" jsonb,
	"notes" text DEFAULT '' NOT NULL,
	"ran_by" uuid NOT NULL,
	"ran_at" timestamp with time zone NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "design_forecast_modes" (
	"design_id" uuid PRIMARY KEY NOT NULL,
	"lab_id" uuid NOT NULL,
	"mode" varchar(16) DEFAULT 'model' NOT NULL,
	"changed_by" uuid NOT NULL,
	"changed_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "bench_micrographs" ADD CONSTRAINT "bench_micrographs_lab_id_labs_id_fk" FOREIGN KEY ("lab_id") REFERENCES "public"."labs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_micrographs" ADD CONSTRAINT "bench_micrographs_run_id_bench_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."bench_runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_micrographs" ADD CONSTRAINT "bench_micrographs_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_runs" ADD CONSTRAINT "bench_runs_lab_id_labs_id_fk" FOREIGN KEY ("lab_id") REFERENCES "public"."labs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_runs" ADD CONSTRAINT "bench_runs_design_id_designs_id_fk" FOREIGN KEY ("design_id") REFERENCES "public"."designs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_runs" ADD CONSTRAINT "bench_runs_revision_id_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."revisions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_runs" ADD CONSTRAINT "bench_runs_ran_by_users_id_fk" FOREIGN KEY ("ran_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "design_forecast_modes" ADD CONSTRAINT "design_forecast_modes_design_id_designs_id_fk" FOREIGN KEY ("design_id") REFERENCES "public"."designs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "design_forecast_modes" ADD CONSTRAINT "design_forecast_modes_lab_id_labs_id_fk" FOREIGN KEY ("lab_id") REFERENCES "public"."labs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "design_forecast_modes" ADD CONSTRAINT "design_forecast_modes_changed_by_users_id_fk" FOREIGN KEY ("changed_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "bench_micrographs_run_idx" ON "bench_micrographs" USING btree ("run_id");--> statement-breakpoint
CREATE INDEX "bench_runs_revision_idx" ON "bench_runs" USING btree ("revision_id");--> statement-breakpoint
CREATE INDEX "bench_runs_lab_idx" ON "bench_runs" USING btree ("lab_id","ran_at");
ALTER TABLE "releases" DROP COLUMN "fab_status";--> statement-breakpoint
ALTER TABLE "releases" DROP COLUMN "fab_status_at";--> statement-breakpoint
DROP TYPE "public"."fab_status";
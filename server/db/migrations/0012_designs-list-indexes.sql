DROP INDEX "designs_lab_idx";--> statement-breakpoint
CREATE INDEX "designs_lab_updated_idx" ON "designs" USING btree ("lab_id","updated_at","id");--> statement-breakpoint
CREATE INDEX "designs_lab_name_idx" ON "designs" USING btree ("lab_id","name","id");--> statement-breakpoint
CREATE INDEX "designs_lab_created_idx" ON "designs" USING btree ("lab_id","created_at","id");
-- The designs list's search runs `name ilike '%…%'`; a trigram index answers it from the index. pg_trgm ships with
-- PostgreSQL (contrib) and is a trusted extension, so the database's owner may create it.
CREATE EXTENSION IF NOT EXISTS pg_trgm;--> statement-breakpoint
CREATE INDEX "designs_name_trgm_idx" ON "designs" USING gin ("name" gin_trgm_ops);

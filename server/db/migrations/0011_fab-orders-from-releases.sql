-- Every release made before orders existed gets its order, numbered per lab in release order. Its fabrication
-- status reads as the order status (shared/fabrication/orderStatus.ts, ORDER_STATUS_OF_OLD_FAB_STATUS):
-- released (not started) → received by the fab; received by the lab → delivered; the rest keep their name.
-- The release's note becomes the order's notes; the columns of releases stay as they were (read by nothing now).
INSERT INTO "fab_orders" ("lab_id", "revision_id", "release_id", "number", "status", "status_at", "notes", "created_by", "created_at")
SELECT r."lab_id", r."revision_id", r."id",
       coalesce((SELECT max(o."number") FROM "fab_orders" o WHERE o."lab_id" = r."lab_id"), 0)
         + row_number() OVER (PARTITION BY r."lab_id" ORDER BY r."released_at", r."id"),
       (CASE r."fab_status"::text WHEN 'released' THEN 'received' WHEN 'received' THEN 'delivered' ELSE r."fab_status"::text END)::"order_status",
       r."fab_status_at", r."note", r."released_by", r."released_at"
FROM "releases" r
WHERE NOT EXISTS (SELECT 1 FROM "fab_orders" o WHERE o."release_id" = r."id");
--> statement-breakpoint
-- An order that had moved on says so in its thread, so the history is not silent about the move.
INSERT INTO "fab_order_messages" ("order_id", "lab_id", "author_id", "body", "status", "created_at")
SELECT o."id", o."lab_id", o."created_by", 'Status carried over from the release (before orders)', o."status", o."status_at"
FROM "fab_orders" o WHERE o."status" <> 'received'
  AND NOT EXISTS (SELECT 1 FROM "fab_order_messages" m WHERE m."order_id" = o."id");

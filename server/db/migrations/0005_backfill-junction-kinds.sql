-- Fill designs.junction_kinds from each design's latest revision summary.
UPDATE designs d SET junction_kinds = ARRAY(SELECT jsonb_array_elements_text(r.summary->'junctionKinds'))
  FROM revisions r WHERE r.id = d.latest_revision_id;

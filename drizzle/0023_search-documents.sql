-- Search by PostgreSQL full-text with indexes instead of reading every released brief into memory:
-- one document per version (title, condition and treatment names of its frozen brief) and one per
-- published translation (its title, condition and treatment names). Accents do not count, as a
-- reader types them or not: unaccent, wrapped as immutable so that the documents can be stored.
CREATE EXTENSION IF NOT EXISTS unaccent;
--> statement-breakpoint
CREATE FUNCTION fairweigh_fold(text) RETURNS text LANGUAGE sql IMMUTABLE PARALLEL SAFE STRICT
  AS $$ SELECT lower(public.unaccent('public.unaccent'::regdictionary, $1)) $$;
--> statement-breakpoint
ALTER TABLE brief_versions ADD COLUMN search_document tsvector GENERATED ALWAYS AS (
  to_tsvector('simple', fairweigh_fold(
    coalesce(snapshot -> 'brief' ->> 'title', '') || ' ' || coalesce(snapshot -> 'brief' ->> 'condition', '') || ' ' ||
    coalesce(jsonb_path_query_array(snapshot, '$.treatments[*].displayName')::text, '')
  ))
) STORED;
--> statement-breakpoint
CREATE INDEX brief_versions_search_idx ON brief_versions USING gin (search_document);
--> statement-breakpoint
ALTER TABLE version_translations ADD COLUMN search_document tsvector GENERATED ALWAYS AS (
  to_tsvector('simple', fairweigh_fold(
    coalesce(jsonb_path_query_array(published_fields, '$.keyvalue() ? (@.key like_regex "^(title|condition|treatment:.*)$").value')::text, '')
  ))
) STORED;
--> statement-breakpoint
CREATE INDEX version_translations_search_idx ON version_translations USING gin (search_document);

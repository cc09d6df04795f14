-- An issued report revision never changes, and signatures are never edited or removed: the
-- database refuses it, whatever the application does.
CREATE OR REPLACE FUNCTION refuse_change_of_signed_record() RETURNS trigger AS $$
BEGIN
  RAISE EXCEPTION '% is immutable once written (% refused)', TG_TABLE_NAME, TG_OP USING ERRCODE = 'insufficient_privilege';
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER reports_immutable BEFORE UPDATE OR DELETE ON reports
  FOR EACH ROW EXECUTE FUNCTION refuse_change_of_signed_record();
--> statement-breakpoint
CREATE TRIGGER reports_no_truncate BEFORE TRUNCATE ON reports
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_change_of_signed_record();
--> statement-breakpoint
CREATE TRIGGER signatures_immutable BEFORE UPDATE OR DELETE ON signatures
  FOR EACH ROW EXECUTE FUNCTION refuse_change_of_signed_record();
--> statement-breakpoint
CREATE TRIGGER signatures_no_truncate BEFORE TRUNCATE ON signatures
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_change_of_signed_record();
